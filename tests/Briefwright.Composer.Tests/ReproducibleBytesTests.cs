using System.Diagnostics;
using System.IO.Compression;
using System.Text;
using Briefwright.Composer.Document;
using Briefwright.Composer.Drawing;
using PdfSharp.Drawing;
using PdfSharp.Pdf;

namespace Briefwright.Composer.Tests;

/// <summary>
/// The reproducibility pass rewrites object dictionaries, the trailer and the XMP metadata only: bytes inside other
/// streams are copied unchanged even when they happen to look like the fields it fixes.
/// </summary>
public class ReproducibleBytesTests
{
    /// <summary>Every pattern the pass rewrites, as it could occur by chance inside compressed data.</summary>
    private const string Lookalikes =
        "/ABCDEF+Font /ID [<0123456789ABCDEF0123456789ABCDEF> <FEDCBA9876543210FEDCBA9876543210>] " +
        "uuid:12345678-1234-1234-1234-123456789abc (D:20991231235959+01'00') /NM(abc-123) " +
        "<xmp:CreateDate>2099-12-31T23:59:59Z</xmp:CreateDate> </rdf:RDF>";

    /// <summary>
    /// Deflate with stored (uncompressed) blocks: valid FlateDecode data that contains the patterns literally, as
    /// compressed data can by chance.
    /// </summary>
    private static byte[] StoredDeflate(string text)
    {
        using var packed = new MemoryStream();
        using (var z = new ZLibStream(packed, CompressionLevel.NoCompression, leaveOpen: true)) z.Write(
            Encoding.ASCII.GetBytes(text));
        return packed.ToArray();
    }

    private static byte[] Inflate(byte[] data)
    {
        using var z = new ZLibStream(new MemoryStream(data), CompressionMode.Decompress);
        using var output = new MemoryStream();
        z.CopyTo(output);
        return output.ToArray();
    }

    /// <summary>
    /// A small PDFsharp document (random subset tag, /ID and XMP uuids) with one extra compressed stream.
    /// </summary>
    private static byte[] Sample(byte[] compressed)
    {
        using var doc = new PdfDocument();
        // PDFsharp's own deflate output draws a qpdf warning (see DocumentComposer)
        doc.Options.CompressContentStreams = false;
        doc.Info.Title = "Sample (invented)";
        doc.Info.CreationDate = new DateTime(2026, 11, 30, 0, 0, 0, DateTimeKind.Utc);
        var page = doc.AddPage();
        using (var g = XGraphics.FromPdfPage(page))
            g.DrawString("Sample text", new XFont(BundledFonts.Family, 12), XBrushes.Black, 50, 50);
        var data = new PdfDictionary(doc);
        data.CreateStream(compressed);
        data.Elements["/Filter"] = new PdfName("/FlateDecode");
        doc.Internals.AddObject(data);
        doc.Internals.Catalog.Elements.SetReference("/PieceInfo", data);
        using var stream = new MemoryStream();
        doc.Save(stream, false);
        return stream.ToArray();
    }

    [Fact]
    public void Stream_contents_that_look_like_fields_are_copied_unchanged()
    {
        BundledFonts.Install();
        byte[] compressed = StoredDeflate(Lookalikes);
        // the pattern is in the raw bytes
        Assert.True(compressed.AsSpan().IndexOf(Encoding.ASCII.GetBytes("/NM(abc-123)")) >= 0);

        byte[] fixedPdf = ReproducibleBytes.Fix(Sample(compressed), new DateOnly(2026, 11, 30));

        int at = fixedPdf.AsSpan().IndexOf(compressed);
        Assert.True(at >= 0, "the compressed stream was changed");
        Assert.Equal(Lookalikes, Encoding.ASCII.GetString(Inflate(fixedPdf[at..(at + compressed.Length)])));
        var (code, output) = Qpdf("--check", fixedPdf);
        Assert.True(code == 0, output);
    }

    [Fact]
    public void Random_fields_outside_streams_are_fixed_and_pdfua_is_declared()
    {
        BundledFonts.Install();
        byte[] compressed = StoredDeflate(Lookalikes);
        byte[] first = Sample(compressed), second = Sample(compressed);
        Assert.NotEqual(first, second); // PDFsharp's subset tag, /ID and XMP uuids are random

        var date = new DateOnly(2026, 11, 30);
        byte[] a = ReproducibleBytes.Fix(first, date), b = ReproducibleBytes.Fix(second, date);
        Assert.Equal(a, b);
        string text = Encoding.Latin1.GetString(a);
        Assert.Contains("<pdfuaid:part>1</pdfuaid:part>", text);
        Assert.Equal(1, CountOf(text, "pdfuaid:part>1<")); // added once, in the XMP, not in the look-alike stream
        var (code, output) = Qpdf("--check", a);
        Assert.True(code == 0, output);
    }

    [Fact]
    public void A_stream_without_a_direct_length_is_refused_rather_than_guessed()
    {
        byte[] pdf = Encoding.Latin1.GetBytes(
            "%PDF-1.7\n1 0 obj\n<</Length 2 0 R>>\nstream\nabc\nendstream\nendobj\n2 0 obj\n3\nendobj\nxref\n0 3\n" +
            "0000000000 65535 f \n0000000009 00000 n \n0000000063 00000 n \ntrailer\n<</Size 3>>\nstartxref\n80\n" +
            "%%EOF\n");
        Assert.Throws<InvalidDataException>(() => ReproducibleBytes.Fix(pdf, new DateOnly(2026, 11, 30)));
    }

    private static int CountOf(string s, string what)
    {
        int n = 0;
        for (
            int i = s.IndexOf(what, StringComparison.Ordinal);
            i >= 0;
            i = s.IndexOf(what, i + 1, StringComparison.Ordinal)) n++;
        return n;
    }

    private static (int Code, string Output) Qpdf(string args, byte[] pdf)
    {
        string path = Path.Combine(Path.GetTempPath(), $"bw-rb-{Guid.NewGuid():N}.pdf");
        File.WriteAllBytes(path, pdf);
        try
        {
            var psi = new ProcessStartInfo("qpdf", $"{args} \"{path}\"") {
                RedirectStandardOutput = true,
                RedirectStandardError = true };
            using var p = Process.Start(psi)!;
            string output = p.StandardOutput.ReadToEnd() + p.StandardError.ReadToEnd();
            p.WaitForExit();
            return (p.ExitCode, output);
        }
        finally
        {
            File.Delete(path);
        }
    }
}
