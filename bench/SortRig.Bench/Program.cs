// Benchmarks are added by the issues that own them; each writes its results table under docs/.
Console.WriteLine("usage: dotnet run -c Release --project bench/SortRig.Bench -- <benchmark>");
return 0;
