using Briefwright.Cli.Batch;

namespace Briefwright.Cli.Tests;

/// <summary>The manifest's own check and path rules.</summary>
public class ManifestTests
{
    private static Manifest Sample() => new(
        "b",
        "b-2026-11-30",
        2,
        "f",
        new Dictionary<string, string> { ["tool"] = "1" },
        ["b-2026-11-30.pdf"])
    {
        Sizes = new Dictionary<string, long> { ["b-2026-11-30.pdf"] = 10 },
        Sha256 = new Dictionary<string, string> { ["b-2026-11-30.pdf"] = new string('a', 64) },
    };

    [Fact]
    public void A_written_manifest_reads_back_with_its_check()
    {
        string text = System.Text.Encoding.UTF8.GetString(Sample().ToBytes());
        var read = Manifest.Parse(text);
        Assert.NotNull(read);
        Assert.Matches("^[0-9a-f]{64}$", read.Check);
        Assert.Equal(10, read.Sizes!["b-2026-11-30.pdf"]);
    }

    [Theory]
    [InlineData("\"edition\": 2", "\"edition\": 3")]            // edited
    [InlineData("\"size", "\"siz")]                              // a field renamed
    public void An_edited_manifest_fails_its_check(string find, string replace)
    {
        string text = System.Text.Encoding.UTF8.GetString(Sample().ToBytes());
        Assert.Contains(find, text);
        Assert.Null(Manifest.Parse(text.Replace(find, replace)));
    }

    [Theory]
    [InlineData("../victim.txt")]
    [InlineData("/etc/passwd")]
    [InlineData("sub/b.pdf")]
    [InlineData("..")]
    [InlineData(".hidden")]
    [InlineData("a\\b")]
    public void A_path_that_is_not_a_plain_file_name_in_the_folder_is_refused(string name)
    {
        var m = Sample() with { Files = [name], Sizes = new Dictionary<string, long> {
            [name] = 1 }, Sha256 = new Dictionary<string, string> { [name] = "0" } };
        Assert.False(Manifest.Confined(name));
        Assert.Null(Manifest.Parse(System.Text.Encoding.UTF8.GetString(m.ToBytes())));
    }

    [Fact]
    public void A_manifest_of_an_earlier_release_without_hashes_is_still_read()
    {
        const string Old = """
            {"id":"a","stem":"a-2000-01-01","edition":1,"hash":"0","inputs":{"tool":"0"},"files":["a-2000-01-01.pdf"]}
            """;
        Assert.NotNull(Manifest.Parse(Old));
    }
}
