namespace Briefwright.Cli;

public static class Program
{
    public static int Main(string[] args)
    {
        try
        {
            if (args is ["build", ..]) Batch.StopSignal.Install(Console.Error);
            return CliApp.Run(
                args, Console.Out, Console.Error, interactive: !Console.IsOutputRedirected, input: Console.In);
        }
        catch (Exception ex)
        {
            // Each command reports its stages' failures itself (StageErrors); what reaches here is a fault of the tool.
            Console.Error.WriteLine($"briefwright: {StageErrors.Internal(ex)}");
            return ExitCodes.Failed;
        }
    }
}
