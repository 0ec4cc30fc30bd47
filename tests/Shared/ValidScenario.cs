namespace Briefwright.TestSupport;

/// <summary>A small valid scenario (invented), shared by the test projects: tests replace one line to break one rule,
/// or add a section. Messages that name its positions (line and column) are checked against it, so change it only
/// with those tests. One copy, compiled into every test project by tests/Directory.Build.props.</summary>
internal static class ValidScenario
{
    public const string Text = """
        brief:
          id: test-brief
          title: Test brief
          organisation: Test Institute (invented)
          date: 2026-11-30
        demography:
          population_growth: 1%
          school_entry_age: 6
          retirement_age: 65
          survival:
            form: rectangular
            max_age: 80
        production:
          saving_rate: 0.2
          capital_share: 0.33
          depreciation: 3%
          technology_growth: 2%
        options:
          - id: base
            label: Base
            schooling_years: 11
          - id: more
            label: More
            schooling_years: 12
        """;
}
