using BenchmarkDotNet.Attributes;
using Briefwright.Brief;
using Briefwright.Scenario;

namespace Briefwright.Benchmarks;

[MemoryDiagnoser]
public class BriefBenchmarks
{
    private ScenarioDocument scenario = null!;

    [GlobalSetup]
    public void Setup()
    {
        scenario = Demo.Load("auroria-national");
        BriefBuilder.Build(scenario, StandardTemplate.Template);
    }

    [Benchmark]
    public object BuildDemoBrief() => BriefBuilder.Build(scenario, StandardTemplate.Template);
}
