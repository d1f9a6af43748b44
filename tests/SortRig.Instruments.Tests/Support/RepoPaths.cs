namespace SortRig.Instruments.Tests.Support;

/// <summary>Finds folders of the repository from the test binaries.</summary>
internal static class RepoPaths
{
    public static string Root
    {
        get
        {
            var dir = new DirectoryInfo(AppContext.BaseDirectory);
            while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
            {
                dir = dir.Parent;
            }

            return dir?.FullName
                ?? throw new InvalidOperationException("SortRig.sln not found above " + AppContext.BaseDirectory);
        }
    }

    public static string Instruments => Path.Combine(Root, "instruments");
}
