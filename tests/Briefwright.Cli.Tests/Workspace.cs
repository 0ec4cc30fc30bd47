using System.Diagnostics;

namespace Briefwright.Cli.Tests;

/// <summary>
/// A temporary copy of the demo scenarios with light Monte Carlo settings, so batch tests run quickly.
/// </summary>
internal sealed class Workspace
{
    public string Dir { get; } = Directory.CreateTempSubdirectory("bw-batch-").FullName;
    public string Out => Path.Combine(Dir, "out");

    public Workspace(params string[] names)
    {
        foreach (var f in Directory.GetFiles(CliAppTests.Demo()))
        {
            string name = Path.GetFileName(f);
            if (name.EndsWith(".yaml") && names.Length > 0 && !names.Contains(Path.GetFileNameWithoutExtension(name))
                && name != "auroria-national.yaml")
                continue;
            string text = File.ReadAllText(f).Replace("draws: 2000", "draws: 60")
                .Replace("sobol_samples: 2560", "sobol_samples: 0")
                .Replace("steps: 9", "steps: 3");
            File.WriteAllText(Path.Combine(Dir, name), text);
        }
    }

    public void Edit(string file, string find, string replace)
    {
        string path = Path.Combine(Dir, file);
        string text = File.ReadAllText(path);
        Assert.Contains(find, text);
        File.WriteAllText(path, text.Replace(find, replace));
    }

    public (int Code, string Out, string Err) Build(params string[] extra)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = CliApp.Run(new[] { "build", Dir, "--no-chart-images", "-q" }.Concat(extra).ToArray(), output, error);
        return (code, output.ToString(), error.ToString());
    }

    public static Process Start(params string[] args)
    {
        var psi = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true };
        psi.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "briefwright.dll"));
        foreach (var a in args) psi.ArgumentList.Add(a);
        return Process.Start(psi)!;
    }
}
