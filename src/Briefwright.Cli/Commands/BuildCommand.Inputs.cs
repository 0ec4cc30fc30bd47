using System.CommandLine;
using System.Globalization;
using System.Text;
using Briefwright.Brief;
using Briefwright.Brief.Formats;
using Briefwright.Cli.Batch;
using Briefwright.Cli.Project;
using Briefwright.Scenario;
using Briefwright.Templating;

namespace Briefwright.Cli.Commands;

/// <summary>What <c>build</c> reads before any scenario: the template, the theme and the option values.</summary>
public static partial class BuildCommand
{
    public const int MaxJobs = 256;

    /// <summary>
    /// The --jobs value: a whole number from 1 to <see cref="MaxJobs"/>, or one per core when not given.
    /// </summary>
    public static int? ParseJobs(string? text, TextWriter error)
    {
        if (text is null) return Environment.ProcessorCount;
        if (int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out int n)
            && n is >= 1 and <= MaxJobs) return n;
        error.WriteLine($"--jobs: must be a whole number from 1 to {MaxJobs}. Got " +
            $"'{Scenario.Binding.BindContext.Printable(text)}'.");
        return null;
    }

    /// <summary>Templates are read up to this size.</summary>
    public const long MaxTemplateBytes = 1 << 20;

    /// <summary>
    /// Reads the template and theme and checks the options; on failure, <paramref name="stage"/> says which was wrong.
    /// </summary>
    private static (BriefTemplate, BuildOptions, string, DateOnly?, (int Index, int Count)?, int)? Setup(
        string? templatePath,
        string? themePath,
        string? dateText,
        string? shardText,
        string? jobsText,
        int? projectJobs,
        string? root,
        TextWriter error,
        out string stage)
    {
        stage = "options";
        int jobs = projectJobs ?? Environment.ProcessorCount;
        if (jobsText is not null)
        {
            if (ParseJobs(jobsText, error) is not { } given) return null;
            jobs = given;
        }
        stage = "template";
        if (ReadTemplate(templatePath, error) is not { } tpl) return null;
        stage = "theme";
        if (ReadTheme(themePath, root, error) is not { } theme) return null;
        var (options, themeHash) = theme;
        stage = "options";
        if (!TryParseDate(dateText, error, out DateOnly? day) || !TryParseShard(shardText, error, out var shard))
            return null;
        return (tpl, options, themeHash, day, shard, jobs);
    }

    /// <summary>The template named (the standard one when none is), or null after printing why it cannot be
    /// used.</summary>
    private static BriefTemplate? ReadTemplate(string? templatePath, TextWriter error)
    {
        try
        {
            if (templatePath is null) return StandardTemplate.Template;
            if (!SafeFile.TryReadBytes(templatePath, null, MaxTemplateBytes, out byte[] bytes, out string why))
            {
                error.WriteLine($"{templatePath}:1:1: cannot read the template ({why}).");
                return null;
            }
            return BriefTemplate.Parse(SafeFile.Decode(bytes), templatePath);
        }
        catch (TemplateException ex)
        {
            var lines = StageErrors.Describe(ex, templatePath ?? "template").Lines;
            foreach (var line in lines.Take(ScenarioInputs.MaxPrinted)) error.WriteLine(line);
            return null;
        }
    }

    /// <summary>The build options of the theme named (its fonts and logo) and the hash that stands for it in the
    /// manifest; the defaults and "standard" when none is named; null after printing the theme's problems.</summary>
    private static (BuildOptions Options, string Hash)? ReadTheme(string? themePath, string? root, TextWriter error)
    {
        var options = BuildOptions.Default;
        string themeHash = "standard";
        if (themePath is null) return (options, themeHash);
        var (spec, problems, sources) = ThemeLoader.Load(themePath, new FileSourceReader(), root);
        ScenarioInputs.Print(problems, sources, error);
        if (spec is null) return null;
        options = options with { Theme = spec };
        themeHash = sources.Hash(); // the theme text as read by the loader; no second read
        if (spec.FontFiles.TryGetValue("regular", out byte[]? regular))
        {
            byte[] bold = spec.FontFiles.GetValueOrDefault("bold", regular);
            var fonts = (regular, bold, spec.FontFiles.GetValueOrDefault("italic", regular),
                spec.FontFiles.GetValueOrDefault("bold_italic", bold));
            options = options with { Fonts = fonts };
            themeHash = Sha256Hex.Of(themeHash + string.Concat(
                new[] { fonts.regular, fonts.bold, fonts.Item3, fonts.Item4 }.Select(b => Sha256Hex.Upper(b))));
        }
        if (spec.Logo is { } png)
        {
            options = options with { Logo = png };
            themeHash = Sha256Hex.Of(themeHash + Sha256Hex.Upper(png.Png));
        }
        return (options, themeHash);
    }

    /// <summary>The --date value (null when not given); false after printing why it is not a date.</summary>
    private static bool TryParseDate(string? dateText, TextWriter error, out DateOnly? day)
    {
        day = null;
        if (dateText is null) return true;
        if (!DateOnly.TryParseExact(dateText, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None,
                out var parsed))
        {
            error.WriteLine($"--date: must be a date written YYYY-MM-DD. Got '{dateText}'.");
            return false;
        }
        day = parsed;
        return true;
    }

    /// <summary>The --shard value K/N (null when not given); false after printing why it is not one.</summary>
    private static bool TryParseShard(string? shardText, TextWriter error, out (int Index, int Count)? shard)
    {
        shard = null;
        if (shardText is null) return true;
        if (!Shards.TryParse(shardText, out int k, out int n))
        {
            error.WriteLine($"--shard: must be K/N with 1 ≤ K ≤ N, such as 3/16. Got '{shardText}'.");
            return false;
        }
        shard = (k, n);
        return true;
    }
}
