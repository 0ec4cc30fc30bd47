using System.Diagnostics;

namespace Briefwright.Brief.Tests;

/// <summary>
/// Runs a PDF checker from poppler-utils or qpdf (installed by .ci/run) on bytes written to a temporary file.
/// </summary>
internal static class ExternalTool
{
    public static (int Code, string Output) Run(string tool, string args, byte[] pdf)
    {
        string path = Path.Combine(Path.GetTempPath(), $"bw-{Guid.NewGuid():N}.pdf");
        File.WriteAllBytes(path, pdf);
        try
        {
            var psi = new ProcessStartInfo(tool, $"{args} \"{path}\"") {
                RedirectStandardOutput = true,
                RedirectStandardError = true };
            using var p = Process.Start(psi) ?? throw new InvalidOperationException($"{tool} did not start.");
            string output = p.StandardOutput.ReadToEnd() + p.StandardError.ReadToEnd();
            p.WaitForExit();
            return (p.ExitCode, output);
        }
        catch (System.ComponentModel.Win32Exception)
        {
            throw new InvalidOperationException(
                $"{tool} is not installed; .ci/run installs it (apt-get install poppler-utils qpdf).");
        }
        finally
        {
            File.Delete(path);
        }
    }
}
