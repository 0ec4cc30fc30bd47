namespace Briefwright.Cli;

/// <summary>Process exit codes; documented in the README.</summary>
public static class ExitCodes
{
    public const int Ok = 0;
    public const int Failed = 1;
    public const int InvalidInput = 2;
}
