using System.Buffers.Binary;
using System.IO.Compression;

namespace Briefwright.Scenario.Tests;

/// <summary>
/// A theme's logo and fonts are read and checked whole before any brief uses them: damaged, truncated, oversized or
/// unsupported files are positioned theme errors (exit code 2), not failures while drawing. PNG layout, chunk CRC-32
/// and zlib image data per the PNG specification (ISO/IEC 15948); TrueType tables per the OpenType specification.
/// </summary>
public class ThemeAssetsTests
{
    private static readonly string Root = RepositoryRoot.Path;

    private static byte[] Chunk(string type, byte[] data)
    {
        var b = new byte[12 + data.Length];
        BinaryPrimitives.WriteUInt32BigEndian(b, (uint)data.Length);
        System.Text.Encoding.ASCII.GetBytes(type).CopyTo(b, 4);
        data.CopyTo(b, 8);
        BinaryPrimitives.WriteUInt32BigEndian(b.AsSpan(8 + data.Length), Crc(b.AsSpan(4, 4 + data.Length)));
        return b;
    }

    /// <summary>
    /// CRC-32 bit by bit, as the PNG specification's Annex D defines it (reflected polynomial 0xEDB88320).
    /// </summary>
    private static uint Crc(ReadOnlySpan<byte> bytes)
    {
        uint c = 0xFFFFFFFF;
        foreach (byte x in bytes)
        {
            c ^= x;
            for (int k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320 ^ (c >> 1) : c >> 1;
        }
        return ~c;
    }

    /// <summary>An RGBA PNG of the given size; <paramref name="rows"/> replaces the image data when given.</summary>
    private static byte[] Png(int w, int h, byte depth = 8, byte interlace = 0, byte[]? rows = null)
    {
        var ihdr = new byte[13];
        BinaryPrimitives.WriteUInt32BigEndian(ihdr, (uint)w);
        BinaryPrimitives.WriteUInt32BigEndian(ihdr.AsSpan(4), (uint)h);
        ihdr[8] = depth; ihdr[9] = 6; ihdr[12] = interlace;
        var raw = rows ?? Enumerable.Range(0, h)
            .SelectMany(_ => new byte[] { 0 }.Concat(Enumerable.Repeat((byte)0x80, w * 4 * depth / 8)))
            .ToArray();
        var z = new MemoryStream();
        using (var zs = new ZLibStream(z, CompressionLevel.Fastest, leaveOpen: true)) zs.Write(raw);
        return new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }.Concat(Chunk("IHDR", ihdr))
            .Concat(Chunk("IDAT", z.ToArray()))
            .Concat(Chunk("IEND", Array.Empty<byte>()))
            .ToArray();
    }

    [Fact]
    public void A_whole_png_passes_with_its_size()
    {
        Assert.Null(ThemeAssets.CheckPng(Png(40, 20), out int w, out int h));
        Assert.Equal((40, 20), (w, h));
        var demo = File.ReadAllBytes(Path.Combine(Root, "briefs-demo", "auroria-institute-logo.png"));
        Assert.Null(ThemeAssets.CheckPng(demo, out _, out _));
    }

    public static TheoryData<string, string> BadPngs() => new()
    {
        { "truncated", "must be a whole PNG image; the file is cut short" },
        { "16-bit", "must have 8 bits per channel; the image has 16" },
        { "huge", "must be at most 4096 × 4096 pixels; the image is 30000 × 30000" },
        { "interlaced", "must not be interlaced" },
        { "flipped", "the checksum of its IDAT chunk does not match" },
        { "short-data", "its image data is cut short" },
        { "jpeg", "must be a PNG image; the file is another kind of file" },
    };

    [Theory]
    [MemberData(nameof(BadPngs))]
    public void A_damaged_or_unsupported_png_is_refused_with_the_reason(string kind, string expected)
    {
        var good = Png(40, 20);
        byte[] png = kind switch
        {
            "truncated" => good[..(good.Length / 2)],
            "16-bit" => Png(40, 20, depth: 16),
            "huge" => Png(30000, 30000, rows: Array.Empty<byte>()),
            "interlaced" => Png(40, 20, interlace: 1),
            "flipped" => Flip(good, 50),
            "short-data" => Png(40, 20, rows: new byte[40 * 4]),
            _ => new byte[] { 0xFF, 0xD8, 0xFF, 0xE0, 0, 0x10 },
        };
        Assert.Contains(expected, ThemeAssets.CheckPng(png, out _, out _));
    }

    private static byte[] Flip(byte[] b, int at)
    {
        var c = (byte[])b.Clone();
        c[at] ^= 0xFF;
        return c;
    }

    [Fact]
    public void The_bundled_fonts_pass_the_font_check()
    {
        foreach (var f in Directory.GetFiles(Path.Combine(Root, "fonts"), "*.ttf"))
            Assert.Null(ThemeAssets.CheckTrueType(File.ReadAllBytes(f)));
    }

    [Fact]
    public void A_truncated_damaged_or_cff_font_is_refused_with_the_reason()
    {
        var ttf = File.ReadAllBytes(Path.Combine(Root, "fonts", "LiberationSans-Regular.ttf"));
        Assert.Contains("runs past the end of the file", ThemeAssets.CheckTrueType(ttf[..(ttf.Length / 3)]));
        Assert.Contains("not a TrueType font", ThemeAssets.CheckTrueType(new byte[100]));
        Assert.Contains("CFF outlines", ThemeAssets.CheckTrueType("OTTO\0\0\0\0\0\0\0\0\0\0"u8.ToArray()));
        var noHead = (byte[])ttf.Clone();
        int count = BinaryPrimitives.ReadUInt16BigEndian(noHead.AsSpan(4));
        for (int i = 0; i < count; i++)
            if (noHead.AsSpan(12 + 16 * i, 4).SequenceEqual("head"u8)) "heaX"u8.CopyTo(noHead.AsSpan(12 + 16 * i));
        Assert.Contains("it has no 'head' table", ThemeAssets.CheckTrueType(noHead));
    }

    [Fact]
    public void An_empty_theme_is_described_as_a_theme()
    {
        var (theme, problems, _) = ThemeLoader.Load("t.theme.yaml", new MemoryReader(new() { ["t.theme.yaml"] = "" }));
        Assert.Null(theme);
        Assert.Equal(
            "t.theme.yaml:1:1: file is empty; a theme needs at least a name. Got nothing.",
            Assert.Single(problems).Message);
    }

    [Theory]
    [InlineData("logo: /etc/logo.png", "t.theme.yaml:2:7: logo: must be a path relative to the file that names it")]
    [InlineData("logo: ../logo.png", "t.theme.yaml:2:7: logo: must stay inside the project folder")]
    [InlineData(
        "fonts:\n  regular: /usr/share/fonts/x.ttf",
        "t.theme.yaml:3:12: fonts.regular: must be a path relative to the file that names it")]
    public void Theme_files_stay_inside_the_project_folder(string line, string expected)
    {
        var (_, problems, _) = ThemeLoader.Load(
            "t.theme.yaml",
            new MemoryReader(new() { ["t.theme.yaml"] = "name: T\n" + line + "\n" }));
        Assert.StartsWith(expected, Assert.Single(problems).Message);
    }

    [Fact]
    public void A_theme_may_set_the_chart_colours_in_option_order()
    {
        var (theme, problems, _) = ThemeLoader.Load("t.theme.yaml", new MemoryReader(
            new() { ["t.theme.yaml"] = "name: T\nchart_colours: [\"#112233\", \"#AABBCC\", \"#445566\"]\n" }));
        Assert.Empty(problems);
        Assert.Equal(new[] { "#112233", "#AABBCC", "#445566" }, theme!.ChartColours);
    }

    [Theory]
    [InlineData(
        "chart_colours: [\"#112233\", red]",
        "t.theme.yaml:2:28: chart_colours[1]: must be a colour written #RRGGBB")]
    [InlineData("chart_colours: [\"#112233\"]", "t.theme.yaml:2:16: chart_colours: must be a list of 2 to 8 colours")]
    [InlineData("chart_colours: \"#112233\"", "t.theme.yaml:2:16: chart_colours: must be a list of 2 to 8 colours")]
    public void Chart_colours_are_a_short_list_of_colours(string line, string expected)
    {
        var (theme, problems, _) = ThemeLoader.Load(
            "t.theme.yaml",
            new MemoryReader(new() { ["t.theme.yaml"] = "name: T\n" + line + "\n" }));
        Assert.Null(theme);
        Assert.StartsWith(expected, Assert.Single(problems).Message);
    }
}
