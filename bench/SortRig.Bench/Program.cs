// Benchmarks are added by the issues that own them; each writes its results table under docs/.
using SortRig.Bench.Drift;
using SortRig.Bench.Planning;

if (args.Length > 0 && args[0] == "planning")
{
    return await PlanningBenchmark.RunAsync(args.Length > 1 ? args[1] : "all", CancellationToken.None);
}

if (args.Length > 0 && args[0] == "settle")
{
    return await SortRig.Bench.Settling.SettleBenchmark.RunAsync(args, CancellationToken.None);
}

if (args.Length > 0 && args[0] == "build")
{
    return await SortRig.Bench.Building.BuildBenchmark.RunAsync(args, CancellationToken.None);
}

if (args.Length > 0 && args[0] == "drift")
{
    return await DriftBenchmark.RunAsync(CancellationToken.None);
}

Console.WriteLine("usage: dotnet run -c Release --project bench/SortRig.Bench -- <benchmark>   (benchmarks: planning [gap|reels|big|cups|timing|probe], settle [parts], drift, build [seeds])");
return 0;
