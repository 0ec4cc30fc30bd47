using System.Text.Json;
using Briefwright.Brief.Formats;
using Briefwright.Scenario;

namespace Briefwright.Brief.Tests.Formats;

/// <summary>
/// The invented national demo brief built once with every format, in the demo's theme (colours and logo).
/// </summary>
internal static class FormatsDemo
{
    private static readonly Lazy<BuiltBrief> Lazy = new(() => Build("auroria-national"));

    public static BuiltBrief National => Lazy.Value;

    public static BuiltBrief Build(string name, int threads = 0)
    {
        var (theme, problems, _) = ThemeLoader.Load(
            Path.Combine(Demo.Root, "briefs-demo", "auroria-institute.theme.yaml"),
            new ThemeReader());
        Assert.True(theme is not null, string.Join("\n", problems));
        var options = new BuildOptions { Theme = theme!, Logo = theme!.Logo, Formats = OutputFormats.All };
        if (threads > 0) options = options with { ModelThreads = threads };
        return BriefBuilder.Build(Demo.Load(name), StandardTemplate.Template, options);
    }

    /// <summary>Reads the theme and its logo from the disk.</summary>
    internal sealed class ThemeReader : ISourceReader
    {
        public bool TryRead(string path, out string text, out string error)
            => new Demo.DiskReader().TryRead(path, out text, out error);

        public bool TryReadBytes(string path, string root, long maxBytes, out byte[] bytes, out string error)
        {
            error = "no such file";
            bytes = System.IO.File.Exists(path) ? System.IO.File.ReadAllBytes(path) : [];
            return System.IO.File.Exists(path);
        }
    }

    public static ThemeSpec Theme() =>
        ThemeLoader.Load(Path.Combine(Demo.Root, "briefs-demo", "auroria-institute.theme.yaml"), new ThemeReader())
            .Theme!;

    public static byte[] File(BuiltBrief brief, string suffix) => brief.Formats.Single(f => f.Suffix == suffix).Bytes;

    public static JsonElement Json(BuiltBrief brief) => JsonDocument.Parse(brief.ResultsJson).RootElement;
}
