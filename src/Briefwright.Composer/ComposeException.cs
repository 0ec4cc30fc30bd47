namespace Briefwright.Composer;

/// <summary>The brief's text asks for something the composer cannot lay out; the message says what and where.</summary>
public sealed class ComposeException(string message) : Exception(message);
