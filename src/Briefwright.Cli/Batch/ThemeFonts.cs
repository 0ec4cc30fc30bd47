namespace Briefwright.Cli.Batch;

/// <summary>Reads a theme's TrueType files; styles not given fall back to the regular face.</summary>
public static class ThemeFonts
{
    public const int MaxBytes = 16 << 20;

    public static (byte[] Regular, byte[] Bold, byte[] Italic, byte[] BoldItalic)? Read(IReadOnlyDictionary<string, string> paths, TextWriter error)
    {
        var bytes = new Dictionary<string, byte[]>();
        foreach (var (style, path) in paths)
        {
            var b = ReadOne(path, error);
            if (b is null) return null;
            bytes[style] = b;
        }
        byte[] regular = bytes["regular"];
        return (regular, bytes.GetValueOrDefault("bold", regular), bytes.GetValueOrDefault("italic", regular), bytes.GetValueOrDefault("bold_italic", bytes.GetValueOrDefault("bold", regular)));
    }

    private static byte[]? ReadOne(string path, TextWriter error)
    {
        try
        {
            var info = new FileInfo(path);
            if (!info.Exists) { error.WriteLine($"{path}: the theme's font file does not exist."); return null; }
            if (info.Length > MaxBytes) { error.WriteLine($"{path}: the font file is over {MaxBytes >> 20} MiB. Got {info.Length >> 20} MiB."); return null; }
            var b = File.ReadAllBytes(path);
            bool trueType = b.Length > 12 && ((b[0] == 0 && b[1] == 1 && b[2] == 0 && b[3] == 0) || (b[0] == 't' && b[1] == 'r' && b[2] == 'u' && b[3] == 'e'));
            if (!trueType)
            {
                bool cff = b.Length > 4 && b[0] == 'O' && b[1] == 'T' && b[2] == 'T' && b[3] == 'O';
                error.WriteLine($"{path}: must be a TrueType font (glyf outlines). Got {(cff ? "an OpenType font with CFF outlines, which cannot be subset for the PDF; use its TrueType version" : "a file that is not a TrueType font")}.");
                return null;
            }
            return b;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"{path}: cannot read the font ({ex.Message}).");
            return null;
        }
    }
}
