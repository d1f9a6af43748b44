namespace SortRig.Planning.Assembly;

/// <summary>Progress of a running assembly, reported after each improvement pass.</summary>
/// <param name="Phase">"sweep" or "neighbourhood pass N".</param>
/// <param name="Sets">Sets found so far.</param>
/// <param name="UpperBound">Proven upper bound on the number of sets.</param>
/// <param name="Elapsed">Time since the search started.</param>
public readonly record struct AssemblyProgress(string Phase, int Sets, int UpperBound, TimeSpan Elapsed);
