namespace Briefwright.Model;

/// <summary>
/// The model stage's failure: the inputs, though each field is within its bounds, leave the model nothing it can
/// compute (Monte Carlo draws or Sobol samples that nearly all break a model rule). The message says what to change;
/// the brief library reports it as an unsolvable scenario, never as a fault of the tool.
/// </summary>
public sealed class ModelRuleException(string message) : InvalidOperationException(message);
