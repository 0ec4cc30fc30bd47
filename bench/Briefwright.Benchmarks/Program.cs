using BenchmarkDotNet.Running;
using Briefwright.Benchmarks;

// dotnet run -c Release -- quick          the stopwatch harness: every budgeted figure and each stage of the demo brief
// dotnet run -c Release -- draw           one Monte Carlo draw, piece by piece
// dotnet run -c Release -- alloc          what one Monte Carlo draw and the demo's Monte Carlo allocate, by type
// dotnet run -c Release -- profile-model  the demo's whole model in a loop, for a sampling profiler (dotnet-trace)
// dotnet run -c Release -- <anything>     BenchmarkDotNet (e.g. --filter '*' --job short)
switch (args.FirstOrDefault())
{
    case "quick":
        Harness.Run();
        break;
    case "draw":
        Harness.Draw();
        break;
    case "alloc":
        Harness.Allocations();
        break;
    case "profile-model":
        Harness.ProfileModel(int.Parse(args.ElementAtOrDefault(1) ?? "20"));
        break;
    default:
        BenchmarkSwitcher.FromAssembly(typeof(ModelBenchmarks).Assembly).Run(args);
        break;
}
