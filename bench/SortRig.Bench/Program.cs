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

if (args.Length > 0 && args[0] == "settle-diag")
{
    return SortRig.Bench.Settling.SettleDiagnosis.Run(args);
}

if (args.Length > 0 && args[0] == "settle-seeds")
{
    return await SortRig.Bench.Settling.SettleSeeds.RunAsync(args, CancellationToken.None);
}

if (args.Length > 0 && args[0] == "settle-limits")
{
    return SortRig.Bench.Settling.SettleLimits.Run(args);
}

if (args.Length > 0 && args[0] == "order")
{
    return await SortRig.Bench.Ordering.OrderBenchmark.RunAsync(
        args.Length > 1 ? args[1] : "all",
        CancellationToken.None
    );
}

if (args.Length > 0 && args[0] == "build")
{
    return await SortRig.Bench.Building.BuildBenchmark.RunAsync(args, CancellationToken.None);
}

if (args.Length > 0 && args[0] == "drift")
{
    return await DriftBenchmark.RunAsync(CancellationToken.None);
}

if (args.Length > 0 && args[0] == "lab")
{
    return await SortRig.Bench.Lab.LabBenchmark.RunAsync(CancellationToken.None);
}

if (args.Length == 4 && args[0] == "lab-worker")
{
    return await SortRig.Bench.Lab.LabWorker.RunAsync(
        args[1],
        args[2],
        double.Parse(args[3], System.Globalization.CultureInfo.InvariantCulture),
        CancellationToken.None
    );
}

Console.WriteLine(
    "usage: dotnet run -c Release --project bench/SortRig.Bench -- <benchmark>   (benchmarks: planning "
        + "[gap|reels|big|cups|cups-write|cups-loss|cups-seeds[:FIRST:COUNT]|show:REEL:K:SEED|timing|probe], settle "
        + "[parts], settle-seeds [parts] [seeds], order "
        + "[quad], "
        + "drift, lab, "
        + "build [seeds])"
);
return 0;
