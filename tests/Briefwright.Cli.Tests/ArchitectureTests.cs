using System.Reflection;
using System.Text.RegularExpressions;
using NetArchTest.Rules;

namespace Briefwright.Cli.Tests;

/// <summary>
/// Rules of the project's structure (DEVELOPERS.md): the model is pure numbers (no files, clocks, JSON, drawing,
/// PDF or YAML), drawing libraries stay in Charts, the PDF library stays in Composer, and only the command line
/// touches files. Compiled-code rules use NetArchTest over every assembly built from src/; clock and file rules are
/// also checked on the source text, since a call such as DateTime.Now is not a type dependency.
/// Each allow-list below names what exists today and why; new entries need the same justification.
/// </summary>
public class ArchitectureTests
{
    private static readonly string Src = Path.Combine(RepositoryRoot.Path, "src");
    private static readonly Dictionary<string, string> None = new();

    /// <summary>Every project under src/ (one assembly each, all referenced by the command line).</summary>
    private static readonly string[] Projects = Directory.GetDirectories(Src)
        .Select(d => Path.GetFileName(d)!)
        .Where(n => n.StartsWith("Briefwright.", StringComparison.Ordinal))
        .Order(StringComparer.Ordinal)
        .ToArray();

    [Fact]
    public void Every_project_under_src_is_covered()
    {
        Assert.Equal(
            ["Briefwright.Brief", "Briefwright.Charts", "Briefwright.Cli", "Briefwright.Composer", "Briefwright.Model",
             "Briefwright.Scenario", "Briefwright.Templating"],
            Projects);
        foreach (var p in Projects) Assert.NotNull(Load(p));
    }

    [Fact]
    public void Model_depends_on_nothing_in_System_IO()
    {
        Assert.Empty(Offenders("Briefwright.Model", ["System.IO"], allowed: None));
    }

    [Fact]
    public void Model_depends_on_no_drawing_pdf_yaml_or_json_library()
    {
        // The results data's names live with its writer (Brief/Annex/ResultsJson.cs, ResultsNaming).
        Assert.Empty(Offenders("Briefwright.Model",
            ["SkiaSharp", "ScottPlot", "PdfSharp", "YamlDotNet", "System.Text.Json"], allowed: None));
    }

    [Fact]
    public void Model_source_reads_no_clock_and_no_unseeded_randomness()
    {
        var clock = new Regex(
            @"\bDateTime(Offset)?\.(Now|UtcNow|Today)\b|\bStopwatch\b|\bRandom\.Shared\b|\bnew\s+Random\s*\(" +
            @"|\bEnvironment\.TickCount|\bTimeProvider\.System\b");
        Assert.Empty(SourceMatches(clock, f => f.StartsWith("src/Briefwright.Model/", StringComparison.Ordinal),
            allowed: None));
    }

    [Fact]
    public void Skia_and_ScottPlot_are_used_only_in_Charts()
    {
        var offenders = Projects.Where(p => p != "Briefwright.Charts")
            .SelectMany(p => Offenders(p, ["SkiaSharp", "ScottPlot"], allowed: None));
        Assert.Empty(offenders);
    }

    [Fact]
    public void PdfSharp_is_used_only_in_Composer()
    {
        var offenders = Projects.Where(p => p != "Briefwright.Composer")
            .SelectMany(p => Offenders(p, ["PdfSharp"], allowed: None));
        Assert.Empty(offenders);
    }

    /// <summary>
    /// The libraries keep no state of their own between calls: what one brief is built with (its language, fonts,
    /// measurer, chart font and words) is made by the caller and passed down, so briefs built at the same time cannot
    /// see each other. A static field must be readonly, and of no type that is mutable state by nature; a field marked
    /// [ThreadStatic] counts as mutable too. Compiler-generated types (lambda caches, generated regular expressions and
    /// JSON metadata) are not ours to shape and are skipped.
    /// </summary>
    [Fact]
    public void The_libraries_keep_no_static_mutable_state()
    {
        var allowed = new Dictionary<string, string>
        {
            // ScottPlot finds typefaces through its static resolver list by family name: one append-only table from a
            // name derived from the font bytes to its typefaces; which font a chart uses is set on the plot itself.
            ["Briefwright.Charts.ChartFontResolver.Families"] = "ScottPlot's resolvers are process-wide",
            // PDFsharp takes one global font resolver and asks it for faces by name: one append-only table from a
            // name derived from the font bytes to those bytes; which family a brief is set in is its RenderSession's.
            ["Briefwright.Composer.Drawing.PdfFontResolver.Registered"] = "PDFsharp's resolver is process-wide",
            // Memos: each value is a pure function of its key, and every key is immutable content (a schedule and
            // horizon, font bytes, a survival curve), so a memo gives every brief the answer it would compute itself.
            ["Briefwright.Model.Dynamics.PresentValue.FactorCache"] = "memo of discount factors, at most 256 entries",
            ["Briefwright.Model.Numerics.TiltedKernel.Cache"] =
                "memo of at most 16 kernels per survival curve, curves held weakly",
            ["Briefwright.Charts.FontSubsetter.Coverage"] = "memo of a font's characters, held weakly per font",
            ["Briefwright.Brief.GlyphCheck.Passed"] = "memo of template and language texts found in a font, at most 64",
        };
        var state = StaticMutableState(["Briefwright.Model", "Briefwright.Scenario", "Briefwright.Templating",
            "Briefwright.Charts", "Briefwright.Composer", "Briefwright.Brief"], allowed);
        Assert.True(state.Count == 0, "static state in the libraries:\n" + string.Join("\n", state));
    }

    /// <summary>Generic types that hold changing state, whether or not the field holding them is readonly.</summary>
    private static readonly Type[] MutableByNature =
    [
        typeof(AsyncLocal<>), typeof(ThreadLocal<>), typeof(System.Collections.Concurrent.ConcurrentDictionary<,>),
        typeof(System.Collections.Concurrent.ConcurrentBag<>), typeof(System.Collections.Concurrent.ConcurrentQueue<>),
        typeof(Dictionary<,>), typeof(List<>), typeof(HashSet<>), typeof(Queue<>), typeof(Stack<>),
        typeof(System.Runtime.CompilerServices.ConditionalWeakTable<,>),
    ];

    /// <summary>"Type.field: why" for every static field of the assemblies that is state, minus the allowed ones.
    /// </summary>
    private static List<string> StaticMutableState(string[] assemblies, IReadOnlyDictionary<string, string> allowed)
    {
        const BindingFlags statics = BindingFlags.Static | BindingFlags.Public | BindingFlags.NonPublic
                                     | BindingFlags.DeclaredOnly;
        var hits = new List<string>();
        foreach (var type in assemblies.SelectMany(a => Load(a).GetTypes()))
        {
            if (IsGenerated(type)) continue;
            foreach (var field in type.GetFields(statics))
            {
                if (field.IsLiteral) continue;
                string name = $"{type.FullName}.{field.Name}";
                var fieldType = field.FieldType.IsGenericType ? field.FieldType.GetGenericTypeDefinition()
                    : field.FieldType;
                string? why = !field.IsInitOnly ? "not readonly"
                    : field.IsDefined(typeof(ThreadStaticAttribute)) ? "[ThreadStatic]"
                    : MutableByNature.Contains(fieldType) ? $"holds a {field.FieldType.Name}"
                    : null;
                if (why is not null && !allowed.ContainsKey(name)) hits.Add($"{name}: {why}");
            }
        }
        return hits;
    }

    /// <summary>A type the compiler or a source generator made (or one nested in it).</summary>
    private static bool IsGenerated(Type type)
    {
        for (var t = type; t is not null; t = t.DeclaringType)
            if (t.IsDefined(typeof(System.Runtime.CompilerServices.CompilerGeneratedAttribute), false)
                || t.IsDefined(typeof(System.CodeDom.Compiler.GeneratedCodeAttribute), false)
                || t.Name.StartsWith('<'))
                return true;
        return type.Namespace?.StartsWith("System.Text.RegularExpressions.Generated", StringComparison.Ordinal) == true;
    }

    private static readonly Dictionary<string, string> FileAccessAllowed = new()
    {
        // Reads the process's working folder (no file is opened) to print scenario paths relative to it.
        ["Briefwright.Scenario.ScenarioLoader"] = "Directory.GetCurrentDirectory to make `extends` paths relative",
    };

    [Fact]
    public void Only_the_command_line_uses_file_types()
    {
        string[] fileTypes =
            ["System.IO.File", "System.IO.Directory", "System.IO.FileStream", "System.IO.FileInfo",
             "System.IO.DirectoryInfo", "System.IO.FileSystemInfo", "System.IO.FileSystemWatcher"];
        var offenders = Projects.Where(p => p != "Briefwright.Cli")
            .SelectMany(p => Offenders(p, fileTypes, FileAccessAllowed));
        Assert.Empty(offenders);
    }

    [Fact]
    public void Only_the_command_line_source_touches_files()
    {
        var allowed = new Dictionary<string, string>
        {
            // Same entry as FileAccessAllowed: reads the working folder's name only, to print relative paths.
            ["src/Briefwright.Scenario/ScenarioLoader.cs: Directory.GetCurrentDirectory"] =
                "makes `extends` paths relative to the working folder; opens no file",
        };
        var files = new Regex(@"\b(File|Directory)\.[A-Z]\w*|\b(FileStream|FileInfo|DirectoryInfo)\b");
        Assert.Empty(SourceMatches(files,
            f => !f.StartsWith("src/Briefwright.Cli/", StringComparison.Ordinal), allowed));
    }

    [Fact]
    public void The_OpenXml_sdk_is_for_the_tests_only()
    {
        // The workbook and document are written by Brief/Formats/OfficePackage: the SDK's packaging kept about 20 MB in
        // the native executable (measured 19 → 40 MB). The tests read the files back and validate them with it.
        var offenders = Projects.SelectMany(p =>
            Offenders(p, ["DocumentFormat.OpenXml", "System.IO.Packaging"], allowed: None));
        Assert.Empty(offenders);
        // The writers return bytes: they hold no file type (checked for every project by the file-access rule too).
        Assert.Empty(Offenders("Briefwright.Brief", ["System.IO.File", "System.IO.FileStream", "System.IO.Directory"],
            allowed: None));
    }

    /// <summary>The assembly built from a project under src/ (the command line's is named after the program).</summary>
    private static Assembly Load(string project) =>
        project == "Briefwright.Cli" ? typeof(Batch.BatchBuilder).Assembly : Assembly.Load(project);

    /// <summary>Types of <paramref name="assembly"/> that depend on any of <paramref name="forbidden"/> (namespaces or
    /// types), minus the allowed ones (compiler-generated nested types count as their declaring type).</summary>
    private static IEnumerable<string> Offenders(string assembly, string[] forbidden,
        IReadOnlyDictionary<string, string> allowed)
    {
        var result = Types.InAssembly(Load(assembly)).Should().NotHaveDependencyOnAny(forbidden).GetResult();
        if (result.IsSuccessful) return [];
        return result.FailingTypes
            .Select(t => t.FullName)
            .Where(n => !allowed.Keys.Any(a => n == a || n.StartsWith(a + "/", StringComparison.Ordinal)
                                               || n.StartsWith(a + "+", StringComparison.Ordinal)))
            .Select(n => $"{assembly}: {n} depends on one of {string.Join(", ", forbidden)}")
            .ToList();
    }

    /// <summary>"file:line: match" for every match in the C# sources under src/ (comment lines skipped) whose
    /// repository-relative path passes <paramref name="include"/>, minus "file: match" entries allowed.</summary>
    private static List<string> SourceMatches(Regex pattern, Func<string, bool> include,
        IReadOnlyDictionary<string, string> allowed)
    {
        var hits = new List<string>();
        foreach (var path in Directory.EnumerateFiles(Src, "*.cs", SearchOption.AllDirectories))
        {
            string rel = Path.GetRelativePath(RepositoryRoot.Path, path).Replace('\\', '/');
            if (rel.Contains("/obj/") || rel.Contains("/bin/") || !include(rel)) continue;
            var lines = File.ReadAllLines(path);
            for (int i = 0; i < lines.Length; i++)
            {
                if (lines[i].TrimStart().StartsWith("//", StringComparison.Ordinal)) continue;
                foreach (Match m in pattern.Matches(lines[i]))
                    if (!allowed.ContainsKey($"{rel}: {m.Value}")) hits.Add($"{rel}:{i + 1}: {m.Value}");
            }
        }
        return hits;
    }
}
