namespace Briefwright.Cli.Batch;

/// <summary>Progress of a batch: a single updating line on a terminal, one plain line per brief otherwise.</summary>
public sealed class Progress(TextWriter output, bool interactive, int total)
{
    private readonly object gate = new();
    private int done;

    public void Done(BriefOutcome o)
    {
        lock (gate)
        {
            done++;
            string what = o.Status switch
            {
                OutcomeStatus.Built => $"built {o.Pdf} (edition {o.Edition}, {o.Pages} pages, {o.Bytes / 1024} KB, " +
                    $"{o.Milliseconds} ms)",
                OutcomeStatus.Skipped => $"up to date, skipped ({o.Pdf})",
                OutcomeStatus.Invalid => "invalid input; nothing written",
                OutcomeStatus.Stopped => $"stopped: {o.Error}",
                _ => $"FAILED: {o.Error}",
            };
            if (o.Archived is not null) what += $"; previous edition kept in {o.Archived}";
            if (o.Recovered is not null) what += $"; recovered: {o.Recovered}";
            if (interactive) output.Write($"\r\u001b[2K[{done}/{total}] {o.Scenario}: {what}");
            else output.WriteLine($"[{done}/{total}] {o.Scenario}: {what}");
        }
    }

    public void Finish()
    {
        if (interactive && done > 0) lock (gate) output.WriteLine();
    }
}
