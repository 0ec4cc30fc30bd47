using System.Diagnostics;
using System.Net;
using System.Text.Json;
using System.Text.RegularExpressions;
using SkiaSharp;

namespace Briefwright.Brief.Tests.Formats;

/// <summary>
/// The web page in a real browser: headless Chromium (Debian's <c>chromium</c>, installed by test.sh) takes a
/// screenshot of the national demo page, and axe-core (from the npm registry, installed by test.sh into <c>.tools/</c>)
/// checks it for accessibility. The rule: no violation that axe rates serious or critical (axe's impact levels).
/// </summary>
public class BrowserTests
{
    internal static string Chromium => Environment.GetEnvironmentVariable("BRIEFWRIGHT_CHROMIUM") ?? "chromium";

    internal static string AxeScript
    {
        get
        {
            string path = Path.Combine(RepositoryRoot.Path, ".tools", "node_modules", "axe-core", "axe.min.js");
            Assert.True(
                File.Exists(path),
                $"{path} is missing; test.sh installs it (npm install --prefix .tools axe-core).");
            return File.ReadAllText(path);
        }
    }

    /// <summary>
    /// Runs headless Chromium on a page and returns what it printed; a missing browser fails with how to install it.
    /// </summary>
    internal static string RunChromium(string dir, params string[] args)
    {
        var psi = new ProcessStartInfo(Chromium) {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            WorkingDirectory = dir };
        foreach (var a in new[] {
            "--headless",
            "--no-sandbox",
            "--disable-gpu",
            "--hide-scrollbars",
            "--no-first-run",
            $"--user-data-dir={Path.Combine(dir, "profile")}" }.Concat(args))
            psi.ArgumentList.Add(a);
        try
        {
            using var p = Process.Start(psi) ?? throw new InvalidOperationException("chromium did not start.");
            var stderr = p.StandardError.ReadToEndAsync();
            string output = p.StandardOutput.ReadToEnd();
            if (!p.WaitForExit(120_000)) { p.Kill(true); throw new TimeoutException("chromium took over two minutes"); }
            Assert.True(p.ExitCode == 0, $"chromium exited {p.ExitCode}: {stderr.Result}");
            return output;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            throw new InvalidOperationException(
                "chromium is not installed; test.sh installs it (apt-get install chromium).");
        }
    }

    private static string TempDir()
    {
        string dir = Path.Combine(Path.GetTempPath(), $"bw-web-{Guid.NewGuid():N}");
        Directory.CreateDirectory(dir);
        return dir;
    }

    [Fact]
    public void Screenshot_of_the_demo_page_shows_the_brief()
    {
        string dir = TempDir();
        try
        {
            string page = Path.Combine(dir, "brief.html");
            File.WriteAllBytes(page, FormatsDemo.File(FormatsDemo.National, "html"));
            string shot = Path.Combine(dir, "shot.png");
            RunChromium(dir, "--window-size=900,1400", $"--screenshot={shot}", new Uri(page).AbsoluteUri);
            using var bitmap = SKBitmap.Decode(shot);
            Assert.NotNull(bitmap);
            Assert.Equal(900, bitmap.Width);
            Assert.Equal(1400, bitmap.Height);
            // The page is drawn: the theme's accent colour (title, headings) and the key findings' shading are on it.
            var theme = FormatsDemo.Theme();
            var accent = SKColor.Parse(theme.Colours["accent"]);
            var box = SKColor.Parse(theme.Colours["box_fill"]);
            int accentPixels = 0, boxPixels = 0;
            for (int y = 0; y < bitmap.Height; y += 2)
                for (int x = 0; x < bitmap.Width; x += 2)
                {
                    var c = bitmap.GetPixel(x, y);
                    if (c == accent) accentPixels++;
                    if (c == box) boxPixels++;
                }
            Assert.True(accentPixels > 500, $"{accentPixels} pixels in the accent colour");
            Assert.True(boxPixels > 5000, $"{boxPixels} pixels in the key findings' shading");
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    /// <summary>
    /// axe-core's violations for a page, run inside headless Chromium: the page with axe inlined writes them into
    /// itself.
    /// </summary>
    internal static List<(string Id, string Impact, int Nodes, string Help)> Axe(string html)
    {
        string dir = TempDir();
        try
        {
            string runner = "<script>" + AxeScript + "</script><script>" +
                "axe.run(document, { resultTypes: ['violations'] }).then(function (r) { var p = " +
                "document.createElement('pre'); p.id = 'axe-results';" +
                " p.textContent = JSON.stringify(r.violations.map(function (v) { return { id: v.id, impact: v.impact " +
                "|| '', nodes: v.nodes.length, help: v.help }; })); document.body.appendChild(p); })" +
                ".catch(function (e) { var p = document.createElement('pre'); p.id = 'axe-results'; p.textContent = " +
                "'ERROR ' + e; document.body.appendChild(p); });</script>";
            int end = html.LastIndexOf("</body>", StringComparison.Ordinal);
            string page = Path.Combine(dir, "axe.html");
            File.WriteAllText(page, html[..end] + runner + html[end..]);
            string dom = RunChromium(dir, "--virtual-time-budget=60000", "--dump-dom", new Uri(page).AbsoluteUri);
            var m = Regex.Match(dom, "<pre id=\"axe-results\">(.*?)</pre>", RegexOptions.Singleline);
            Assert.True(m.Success, "axe wrote no results: " + dom[Math.Max(0, dom.Length - 500)..]);
            string json = WebUtility.HtmlDecode(m.Groups[1].Value);
            Assert.False(json.StartsWith("ERROR", StringComparison.Ordinal), json);
            return JsonDocument.Parse(json).RootElement.EnumerateArray().Select(v => (v.GetProperty("id")
                .GetString()!, v.GetProperty("impact").GetString()!,
                v.GetProperty("nodes").GetInt32(), v.GetProperty("help").GetString()!)).ToList();
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Axe_finds_no_serious_or_critical_violation_on_the_demo_page()
    {
        var violations = Axe(System.Text.Encoding.UTF8.GetString(FormatsDemo.File(FormatsDemo.National, "html")));
        var serious = violations.Where(v => v.Impact is "serious" or "critical").ToList();
        Assert.True(
            serious.Count == 0,
            string.Join("\n", serious.Select(v => $"{v.Impact} {v.Id} ({v.Nodes}): {v.Help}")));
    }

    [Fact]
    public void Axe_run_this_way_reports_what_is_wrong()
    {
        // The same page with an unlabelled image and a table header without a scope that fits: the harness must see
        // them.
        string html = System.Text.Encoding.UTF8.GetString(FormatsDemo.File(FormatsDemo.National, "html"))
            .Replace(
                "<main id=\"main\">",
                "<main id=\"main\"><img src=\"data:image/png;base64,iVBORw0KGgo=\">",
                StringComparison.Ordinal)
            .Replace("<html lang=\"en-GB\">", "<html>", StringComparison.Ordinal);
        var violations = Axe(html);
        Assert.Contains(violations, v => v.Id == "image-alt" && v.Impact == "critical");
        Assert.Contains(violations, v => v.Id == "html-has-lang" && v.Impact == "serious");
    }
}
