namespace Briefwright.Brief;

/// <summary>
/// The model could not solve a scenario that passed validation (a result that would not be finite, a Monte Carlo run
/// whose draws nearly all break a model rule). It is the scenario's problem, not the tool's: the command line reports
/// it with the scenario's name and exit code 2.
/// </summary>
public sealed class UnsolvableScenarioException(string message, Exception inner) : Exception(message, inner);
