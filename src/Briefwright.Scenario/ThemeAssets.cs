using System.Buffers.Binary;
using System.IO.Compression;

namespace Briefwright.Scenario;

/// <summary>
/// Checks a theme's logo and fonts before anything uses them, so that a truncated, corrupt, oversized or unsupported
/// file is a positioned theme error instead of a failure while the brief is drawn.
/// </summary>
public static class ThemeAssets
{
    public const int MaxLogoBytes = 2 << 20;
    public const int MaxLogoPixels = 4096;
    public const int MaxFontBytes = 16 << 20;

    /// <summary>Why <paramref name="png"/> cannot be the logo, or null with its size: a PNG of 8 bits per channel, not
    /// interlaced, at most <see cref="MaxLogoPixels"/> pixels a side, whose chunks, checksums and image data are
    /// whole.</summary>
    public static string? CheckPng(byte[] png, out int width, out int height)
    {
        width = height = 0;
        ReadOnlySpan<byte> signature = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A];
        if (png.Length < 8 || !png.AsSpan(0, 8).SequenceEqual(signature))
            return "must be a PNG image; the file is another kind of file";
        if (png.Length < 33 || BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(8)) != 13
            || !png.AsSpan(12, 4).SequenceEqual("IHDR"u8))
            return "must be a whole PNG image; its header is missing or cut short";
        long w = BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(16));
        long h = BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(20));
        int depth = png[24], colour = png[25], interlace = png[28];
        if (w == 0 || h == 0) return "must have a size; the image is 0 pixels wide or high";
        if (w > MaxLogoPixels || h > MaxLogoPixels)
            return $"must be at most {MaxLogoPixels} × {MaxLogoPixels} pixels; the image is {w} × {h}";
        int channels = colour switch { 0 => 1, 2 => 3, 3 => 1, 4 => 2, 6 => 4, _ => 0 };
        if (channels == 0 || png[26] != 0 || png[27] != 0)
            return "must be a standard PNG image; its header names an unknown colour type or method";
        if (depth != 8) return $"must have 8 bits per channel; the image has {depth}";
        if (interlace != 0) return "must not be interlaced; save it again without interlacing";

        var data = new MemoryStream();
        bool palette = false, end = false;
        int at = 8;
        while (at < png.Length && !end)
        {
            if (png.Length - at < 12) return "must be a whole PNG image; the file is cut short";
            long length = BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at));
            if (length > png.Length - at - 12) return "must be a whole PNG image; the file is cut short";
            var type = png.AsSpan(at + 4, 4);
            uint crc = BinaryPrimitives.ReadUInt32BigEndian(png.AsSpan(at + 8 + (int)length));
            if (Crc32(png.AsSpan(at + 4, 4 + (int)length)) != crc)
                return "must be an undamaged PNG image; the " +
                    $"checksum of its {System.Text.Encoding.ASCII.GetString(type)} chunk does not match";
            if (type.SequenceEqual("IDAT"u8)) data.Write(png, at + 8, (int)length);
            else if (type.SequenceEqual("PLTE"u8)) palette = true;
            else if (type.SequenceEqual("IEND"u8)) end = true;
            at += 12 + (int)length;
        }
        if (!end) return "must be a whole PNG image; the file ends before its IEND chunk";
        if (colour == 3 && !palette) return "must be a whole PNG image; its palette is missing";
        if (CheckImageData(data, 1 + w * channels, h) is { } why) return why;
        width = (int)w;
        height = (int)h;
        return null;
    }

    /// <summary>Why the joined IDAT chunks in <paramref name="data"/> cannot be <paramref name="rows"/> rows of
    /// <paramref name="row"/> bytes (a filter byte, then the pixels), or null.</summary>
    private static string? CheckImageData(MemoryStream data, long row, long rows)
    {
        long expected = row * rows;
        try
        {
            data.Position = 0;
            using var z = new ZLibStream(data, CompressionMode.Decompress);
            var buffer = new byte[1 << 16];
            long seen = 0;
            int n;
            while ((n = z.Read(buffer, 0, buffer.Length)) > 0)
            {
                for (int i = 0; i < n; i++)
                    if ((seen + i) % row == 0 && buffer[i] > 4)
                        return "must be an undamaged PNG image; its image data is corrupt";
                seen += n;
                if (seen > expected)
                    return "must be an undamaged PNG image; it holds more image data than its size allows";
            }
            if (seen < expected) return "must be a whole PNG image; its image data is cut short";
        }
        catch (InvalidDataException)
        {
            return "must be an undamaged PNG image; its image data cannot be decompressed";
        }
        return null;
    }

    private static readonly uint[] CrcTable = Enumerable.Range(0, 256).Select(n =>
    {
        uint c = (uint)n;
        for (int k = 0; k < 8; k++) c = (c & 1) != 0 ? 0xEDB88320u ^ (c >> 1) : c >> 1;
        return c;
    }).ToArray();

    private static uint Crc32(ReadOnlySpan<byte> bytes)
    {
        uint c = 0xFFFFFFFFu;
        foreach (byte b in bytes) c = CrcTable[(c ^ b) & 0xFF] ^ (c >> 8);
        return c ^ 0xFFFFFFFFu;
    }

    private static readonly string[] RequiredTables =
        { "cmap", "glyf", "head", "hhea", "hmtx", "loca", "maxp", "name", "post" };

    /// <summary>Why <paramref name="ttf"/> cannot be a theme font, or null: a TrueType font (glyf outlines) whose table
    /// directory, required tables, glyph index and character map are whole and consistent.</summary>
    public static string? CheckTrueType(byte[] ttf)
    {
        if (ttf.Length >= 4 && ttf.AsSpan(0, 4).SequenceEqual("OTTO"u8))
            return "must be a TrueType font (glyf outlines); the file is an OpenType font with CFF outlines, which " +
                "cannot be subset for the PDF; use its TrueType version";
        if (ttf.Length < 12 || !(BinaryPrimitives.ReadUInt32BigEndian(ttf) is 0x00010000u or 0x74727565u))
            return "must be a TrueType font (glyf outlines); the file is not a TrueType font";
        int count = BinaryPrimitives.ReadUInt16BigEndian(ttf.AsSpan(4));
        if (count == 0 || count > 256 || 12 + 16L * count > ttf.Length)
            return "must be a whole TrueType font; its table directory is cut short or damaged";
        var tables = new Dictionary<string, (int Offset, int Length)>(StringComparer.Ordinal);
        for (int i = 0; i < count; i++)
        {
            var entry = ttf.AsSpan(12 + 16 * i, 16);
            string tag = System.Text.Encoding.ASCII.GetString(entry[..4]);
            long offset = BinaryPrimitives.ReadUInt32BigEndian(entry[8..]);
            long length = BinaryPrimitives.ReadUInt32BigEndian(entry[12..]);
            if (offset + length > ttf.Length)
                return $"must be a whole TrueType font; its '{BindingSafe(tag)}' table runs past the end of the file";
            tables[tag] = ((int)offset, (int)length);
        }
        foreach (var name in RequiredTables)
            if (!tables.ContainsKey(name)) return $"must be a whole TrueType font; it has no '{name}' table";
        var head = Table(ttf, tables["head"]);
        if (head.Length < 54 || BinaryPrimitives.ReadUInt32BigEndian(head[12..]) != 0x5F0F3CF5u)
            return "must be an undamaged TrueType font; its 'head' table is damaged";
        int unitsPerEm = BinaryPrimitives.ReadUInt16BigEndian(head[18..]);
        int locFormat = BinaryPrimitives.ReadInt16BigEndian(head[50..]);
        if (unitsPerEm is < 16 or > 16384 || locFormat is not (0 or 1))
            return "must be an undamaged TrueType font; its 'head' table is damaged";
        var maxp = Table(ttf, tables["maxp"]);
        if (maxp.Length < 6) return "must be an undamaged TrueType font; its 'maxp' table is damaged";
        int glyphs = BinaryPrimitives.ReadUInt16BigEndian(maxp[4..]);
        var hhea = Table(ttf, tables["hhea"]);
        if (glyphs == 0 || hhea.Length < 36)
            return "must be an undamaged TrueType font; it has no glyphs or its 'hhea' table is damaged";
        int metrics = BinaryPrimitives.ReadUInt16BigEndian(hhea[34..]);
        if (metrics == 0 || metrics > glyphs
            || Table(ttf, tables["hmtx"]).Length < 4L * metrics + 2L * (glyphs - metrics))
            return "must be an undamaged TrueType font; its glyph widths ('hmtx') do not match its glyph count";
        var loca = Table(ttf, tables["loca"]);
        int step = locFormat == 0 ? 2 : 4;
        if (loca.Length < (glyphs + 1L) * step)
            return "must be an undamaged TrueType font; its glyph index ('loca') is cut short";
        long previous = 0, glyf = tables["glyf"].Length;
        for (int g = 0; g <= glyphs; g++)
        {
            long offset = step == 2
                ? BinaryPrimitives.ReadUInt16BigEndian(loca[(2 * g)..]) * 2L
                : BinaryPrimitives.ReadUInt32BigEndian(loca[(4 * g)..]);
            if (offset < previous || offset > glyf)
                return "must be an undamaged TrueType font; its glyph index ('loca') points outside the glyphs";
            previous = offset;
        }
        return CheckCharacterMap(Table(ttf, tables["cmap"]));
    }

    /// <summary>Why the character map <paramref name="cmap"/> is damaged or maps no Unicode, or null.</summary>
    private static string? CheckCharacterMap(ReadOnlySpan<byte> cmap)
    {
        if (cmap.Length < 4) return "must be an undamaged TrueType font; its character map ('cmap') is damaged";
        int maps = BinaryPrimitives.ReadUInt16BigEndian(cmap[2..]);
        if (4L + 8L * maps > cmap.Length)
            return "must be an undamaged TrueType font; its character map ('cmap') is cut short";
        bool unicode = false;
        for (int i = 0; i < maps; i++)
        {
            int platform = BinaryPrimitives.ReadUInt16BigEndian(cmap[(4 + 8 * i)..]);
            int encoding = BinaryPrimitives.ReadUInt16BigEndian(cmap[(6 + 8 * i)..]);
            long offset = BinaryPrimitives.ReadUInt32BigEndian(cmap[(8 + 8 * i)..]);
            if (offset + 4 > cmap.Length)
                return "must be an undamaged TrueType font; its character map ('cmap') points outside itself";
            unicode |= platform == 0 || (platform == 3 && encoding is 1 or 10);
        }
        return unicode ? null : "must be a TrueType font with a Unicode character map; this one has none";
    }

    private static ReadOnlySpan<byte> Table(byte[] ttf, (int Offset, int Length) t) => ttf.AsSpan(t.Offset, t.Length);

    private static string BindingSafe(string tag) =>
        new(tag.Select(c => c is >= ' ' and < (char)127 ? c : '?').ToArray());
}
