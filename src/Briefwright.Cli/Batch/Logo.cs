namespace Briefwright.Cli.Batch;

/// <summary>Reads a PNG logo and its pixel size from the IHDR chunk.</summary>
public static class Logo
{
    public const int MaxBytes = 2 << 20;

    public static (byte[] Png, int Width, int Height)? Read(string path, TextWriter error)
    {
        try
        {
            var info = new FileInfo(path);
            if (!info.Exists) { error.WriteLine($"{path}: the theme's logo does not exist."); return null; }
            if (info.Length > MaxBytes) { error.WriteLine($"{path}: the logo is over {MaxBytes / 1024} KiB. Got {info.Length / 1024} KiB."); return null; }
            var bytes = File.ReadAllBytes(path);
            ReadOnlySpan<byte> signature = new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A };
            if (bytes.Length < 24 || !bytes.AsSpan(0, 8).SequenceEqual(signature)) { error.WriteLine($"{path}: the logo must be a PNG image. Got another kind of file."); return null; }
            int width = (bytes[16] << 24) | (bytes[17] << 16) | (bytes[18] << 8) | bytes[19];
            int height = (bytes[20] << 24) | (bytes[21] << 16) | (bytes[22] << 8) | bytes[23];
            if (width <= 0 || height <= 0) { error.WriteLine($"{path}: the logo has no size."); return null; }
            return (bytes, width, height);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            error.WriteLine($"{path}: cannot read the logo ({ex.Message}).");
            return null;
        }
    }
}
