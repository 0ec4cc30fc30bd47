namespace Briefwright.Cli;

public static class Program
{
    public static int Main(string[] args)
    {
        try
        {
            if (args is ["build", ..]) Batch.StopSignal.Install(Console.Error);
            return CliApp.Run(args, Console.Out, Console.Error, interactive: !Console.IsOutputRedirected, input: Console.In);
        }
        catch (Exception ex)
        {
            Console.Error.WriteLine($"briefwright: internal error, please report it: {ex.GetType().Name}: {ex.Message}");
            return ExitCodes.Failed;
        }
    }
}
