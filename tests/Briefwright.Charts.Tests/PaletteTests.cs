using ScottPlot;

namespace Briefwright.Charts.Tests;

/// <summary>
/// The option palette stays distinguishable for readers with the common red-green colour-vision deficiencies and in
/// greyscale print.
/// </summary>
public class PaletteTests
{
    // Simulation matrices for protanopia and deuteranopia at severity 1.0, applied to linear sRGB: Machado, Oliveira
    // & Fernandes (2009), "A physiologically-based model for simulation of color vision deficiency", IEEE TVCG 15(6),
    // table of matrices by severity. Values written from memory of that table.
    private static readonly double[,] Protanopia =
    {
        { 0.152286, 1.052583, -0.204868 },
        { 0.114503, 0.786281, 0.099216 },
        { -0.003882, -0.048116, 1.051998 },
    };

    private static readonly double[,] Deuteranopia =
    {
        { 0.367322, 0.860646, -0.227968 },
        { 0.280085, 0.672501, 0.047413 },
        { -0.011820, 0.042940, 0.968881 },
    };

    /// <summary>
    /// Minimum CIE76 difference between any two options, in every view. Common practice: about 2.3 is a just-noticeable
    /// difference; 20 keeps categories apart at a glance in thin lines and small markers.
    /// </summary>
    private const double MinDeltaE = 20;

    /// <summary>
    /// Minimum difference in CIELAB lightness L* between any two options, the only thing left in greyscale.
    /// </summary>
    private const double MinGreyDelta = 8;

    // sRGB transfer function and D65 matrices: IEC 61966-2-1 (sRGB); CIELAB: CIE 15:2004.
    private static double Linear(byte c)
    {
        double v = c / 255.0;
        return v <= 0.04045 ? v / 12.92 : Math.Pow((v + 0.055) / 1.055, 2.4);
    }

    private static (double L, double A, double B) Lab(double r, double g, double b)
    {
        double x = (0.4124564 * r + 0.3575761 * g + 0.1804375 * b) / 0.95047;
        double y = 0.2126729 * r + 0.7151522 * g + 0.0721750 * b;
        double z = (0.0193339 * r + 0.1191920 * g + 0.9503041 * b) / 1.08883;
        static double F(double t) => t > 216.0 / 24389 ? Math.Cbrt(t) : (24389.0 / 27 * t + 16) / 116;
        return (116 * F(y) - 16, 500 * (F(x) - F(y)), 200 * (F(y) - F(z)));
    }

    private static (double L, double A, double B) View(Color c, double[,]? m)
    {
        double r = Linear(c.R), g = Linear(c.G), b = Linear(c.B);
        if (m is not null)
        {
            double Row(int i) => Math.Clamp(m[i, 0] * r + m[i, 1] * g + m[i, 2] * b, 0, 1);
            (r, g, b) = (Row(0), Row(1), Row(2));
        }
        return Lab(r, g, b);
    }

    private static double DeltaE((double L, double A, double B) p, (double L, double A, double B) q) =>
        Math.Sqrt(Math.Pow(p.L - q.L, 2) + Math.Pow(p.A - q.A, 2) + Math.Pow(p.B - q.B, 2));

    public static TheoryData<string, double[,]?> Views() => new()
    {
        { "normal vision", null },
        { "protanopia", Protanopia },
        { "deuteranopia", Deuteranopia },
    };

    [Theory]
    [MemberData(nameof(Views))]
    public void Every_pair_of_option_colours_stays_apart(string view, double[,]? matrix)
    {
        var colours = Palette.Options;
        for (int i = 0; i < colours.Length; i++)
            for (int j = i + 1; j < colours.Length; j++)
            {
                double d = DeltaE(View(colours[i], matrix), View(colours[j], matrix));
                Assert.True(
                    d >= MinDeltaE,
                    $"{view}: options {i + 1} and {j + 1} differ by {d:0.0} (CIE76), below {MinDeltaE}");
            }
    }

    [Fact]
    public void Every_pair_of_option_colours_differs_in_greyscale()
    {
        var colours = Palette.Options;
        for (int i = 0; i < colours.Length; i++)
            for (int j = i + 1; j < colours.Length; j++)
            {
                double d = Math.Abs(View(colours[i], null).L - View(colours[j], null).L);
                Assert.True(
                    d >= MinGreyDelta,
                    $"options {i + 1} and {j + 1} differ by {d:0.0} in lightness, below {MinGreyDelta}");
            }
    }

    [Fact]
    public void The_simulation_turns_red_and_green_alike_for_a_deuteranope()
    {
        // A check of the check: pure red and a green of similar lightness are far apart with normal vision and much
        // closer once simulated, as the deficiency predicts.
        var red = Color.FromHex("#D03030");
        var green = Color.FromHex("#6A8A00");
        double normal = DeltaE(View(red, null), View(green, null));
        double deutan = DeltaE(View(red, Deuteranopia), View(green, Deuteranopia));
        Assert.True(deutan < normal / 2, $"normal {normal:0.0}, deuteranopia {deutan:0.0}");
    }

    [Fact]
    public void An_option_keeps_one_style_and_the_baseline_comes_last()
    {
        var styles = new OptionStyles(new[] { "base", "a", "b" }, baselineId: "base");
        Assert.Equal(Palette.Options[0], styles["a"].Color);
        Assert.Equal(LinePattern.Solid, styles["a"].Pattern);
        Assert.Equal(Palette.Options[1], styles["b"].Color);
        Assert.Equal(Palette.Options[2], styles["base"].Color);
        Assert.Equal(3, new[] { styles["a"].Marker, styles["b"].Marker, styles["base"].Marker }.Distinct().Count());
        var themed = new OptionStyles(new[] { "a", "b" }, OptionStyles.FromHex(new[] { "#112233", "#445566" }));
        Assert.Equal(Color.FromHex("#445566"), themed["b"].Color);
    }

    [Fact]
    public void No_neutral_tone_is_an_option_colour()
    {
        foreach (var neutral in new[] { Palette.Neutral, Palette.NeutralLight, Palette.Band, Palette.Ink })
            Assert.All(Palette.Options, o => Assert.True(DeltaE(View(o, null), View(neutral, null)) >= MinDeltaE / 2));
    }
}
