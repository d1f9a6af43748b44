namespace SortRig.Host.ReportVerb;

/// <summary>What the report verb wrote.</summary>
/// <param name="Folder">Report folder (full path).</param>
/// <param name="Files">File names written, in writing order.</param>
/// <param name="Notes">Things the reader should know (e.g. no band edges drawn, and why).</param>
internal sealed record ReportResult(string Folder, IReadOnlyList<string> Files, IReadOnlyList<string> Notes);
