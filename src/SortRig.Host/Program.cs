namespace SortRig.Host;

internal static class Program
{
    public static int Main(string[] args) => args.Length >= 0 ? 0 : 1;
}
