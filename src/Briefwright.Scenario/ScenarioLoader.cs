using Briefwright.Model.Inputs;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario;

/// <summary>
/// The outcome of loading a scenario: the document, or every problem found, with the sources to show them.
/// </summary>
public sealed record LoadResult(ScenarioDocument? Document, IReadOnlyList<Diagnostic> Problems, SourceSet Sources)
{
    public bool Ok => Document is not null && Problems.Count == 0;
}

/// <summary>
/// Loads a scenario file: reads YAML with positions, follows <c>extends</c> (deep merge, child wins, paths relative
/// to the file that names them, cycles reported), reads life tables, then binds and validates. Every file a scenario
/// names must lie inside the project folder (<see cref="ProjectRoot"/>): the scenario's own folder, or
/// <paramref name="root"/> when given.
/// </summary>
public sealed class ScenarioLoader(ISourceReader reader, string? root = null)
{
    public const int MaxExtendsDepth = 16;

    public LoadResult Load(string path)
    {
        var sources = new SourceSet();
        var problems = new List<Diagnostic>();
        var files = new List<string>();
        string project = ProjectRoot.For(path, root);
        var tree = LoadTree(path, project, new List<string>(), sources, problems, files, null);
        if (tree is null || problems.Count > 0) return new LoadResult(null, problems, sources);

        var ctx = new BindContext();
        var tables = new List<string>();
        var binder = new ScenarioBinder(ctx, (file, at, fieldPath) =>
            LoadLifeTable(file, at, fieldPath, project, ctx, sources, files, tables));
        var document = binder.Bind(tree, files);
        return new LoadResult(document is null ? null : document with
        {
            InputHash = sources.Hash(), ContentHash = ScenarioContent.Hash(tree, tables),
            EditionAt = ScenarioContent.EditionAt(tree),
        }, ctx.Problems, sources);
    }

    private TabulatedSurvival? LoadLifeTable(string file, SourceSpan at, string fieldPath, string project,
        BindContext ctx, SourceSet sources, List<string> files, List<string> tables)
    {
        if (!file.EndsWith(".csv", StringComparison.OrdinalIgnoreCase))
        {
            ctx.Report(at, fieldPath, "must name a life table file (.csv)", BindContext.Quote(file));
            return null;
        }
        if (ProjectRoot.Resolve(at.File, file, project, out string rule) is not { } full)
        {
            ctx.Report(at, fieldPath, rule, BindContext.Quote(file));
            return null;
        }
        if (!reader.TryReadInside(full, project, out string text, out string error))
        {
            ctx.Report(at, fieldPath, $"cannot read the life table ({error})", $"'{file}'");
            return null;
        }
        if (text.Contains('\0'))
        {
            ctx.Report(at, fieldPath, "the life table is binary, not CSV text", "a NUL byte");
            return null;
        }
        sources.Add(full, text);
        files.Add(full);
        tables.Add(text);
        return LifeTableReader.Read(full, text, fieldPath, ctx);
    }

    private YMapping? LoadTree(string path, string project, List<string> chain, SourceSet sources,
        List<Diagnostic> problems, List<string> files, (SourceSpan At, string Value)? namedBy)
    {
        string key = Path.GetFullPath(path);
        if (chain.Contains(key))
        {
            var cycle = string.Join(" → ", chain.Skip(chain.IndexOf(key)).Append(key).Select(Path.GetFileName));
            problems.Add(new Diagnostic(namedBy!.Value.At, "extends",
                $"scenarios extend each other in a cycle ({cycle})", $"'{namedBy.Value.Value}'"));
            return null;
        }
        if (chain.Count >= MaxExtendsDepth)
        {
            problems.Add(new Diagnostic(namedBy!.Value.At, "extends",
                $"more than {MaxExtendsDepth} levels of extends", $"'{namedBy.Value.Value}'"));
            return null;
        }
        if (ReadText(path, project, namedBy, problems) is not { } text) return null;
        // A binary file is not shown: its first line could be anything (a key, the environment of /proc/self/environ).
        if (!text.Contains('\0')) sources.Add(path, text);
        files.Add(path);
        var (node, readProblems) = YamlTreeReader.Read(path, text, "scenario");
        problems.AddRange(readProblems);
        if (node is null) return null;
        if (node is not YMapping map)
        {
            problems.Add(new Diagnostic(node.At, "",
                "a scenario must be a mapping with the sections brief, demography, human_capital, production " +
                "and options", node.Kind));
            return null;
        }
        if (map["extends"] is not { } ext) return map;
        if (ext is not YScalar { IsNull: false } parentName)
        {
            problems.Add(new Diagnostic(ext.At, "extends", "must be the path of another scenario file", ext.Kind));
            return null;
        }
        if (!parentName.Value.EndsWith(".yaml", StringComparison.OrdinalIgnoreCase)
            && !parentName.Value.EndsWith(".yml", StringComparison.OrdinalIgnoreCase))
        {
            problems.Add(new Diagnostic(parentName.At, "extends",
                "must name a scenario file (.yaml or .yml)", BindContext.Quote(parentName.Value)));
            return null;
        }
        if (ProjectRoot.Resolve(path, parentName.Value, project, out string rule) is not { } parentPath)
        {
            problems.Add(new Diagnostic(parentName.At, "extends", rule, BindContext.Quote(parentName.Value)));
            return null;
        }
        chain.Add(key);
        var parent = LoadTree(parentPath, project, chain, sources, problems, files, (parentName.At, parentName.Value));
        chain.RemoveAt(chain.Count - 1);
        return parent is null ? null : Merge(parent, map);
    }

    /// <summary>The text of the scenario at <paramref name="path"/>, or null with the reason reported.</summary>
    private string? ReadText(string path, string project, (SourceSpan At, string Value)? namedBy,
        List<Diagnostic> problems)
    {
        string text, error;
        if (namedBy is null
            ? !reader.TryRead(path, out text, out error)
            : !reader.TryReadInside(path, project, out text, out error))
        {
            if (namedBy is { } by)
                problems.Add(new Diagnostic(by.At, "extends",
                    $"cannot read the extended scenario ({error})", $"'{by.Value}'"));
            else problems.Add(new Diagnostic(new SourceSpan(path, 1, 1), "",
                $"cannot read the scenario ({error})", null));
            return null;
        }
        return text;
    }

    /// <summary>
    /// A full path as messages show it: relative to the current folder when it lies below it, else in full.
    /// </summary>
    public static string Display(string full)
    {
        string cwd = Directory.GetCurrentDirectory();
        return ProjectRoot.IsInside(full, cwd) && full != cwd ? Path.GetRelativePath(cwd, full) : full;
    }

    /// <summary>A section that switches its <c>form</c> (say, from gompertz_makeham to life_table) or a parameter that
    /// switches its <c>distribution</c> (say, from uniform to normal) is replaced, not merged: the parent's parameters
    /// of the old form never stick to the child's.</summary>
    private static bool FormChanges(YMapping parent, YMapping child) =>
        KindChanges(parent, child, "form") || KindChanges(parent, child, "distribution");

    private static bool KindChanges(YMapping parent, YMapping child, string key) =>
        child[key] is YScalar c && (parent[key] is not YScalar p || p.Value != c.Value);

    /// <summary>Deep merge: mappings merge key by key, the child's value winning; lists and scalars are replaced whole,
    /// and so is a mapping whose <c>form</c> changes and a parameter given as <c>{ value, source, note }</c> (so a
    /// parent's note never sticks to a child's value).</summary>
    public static YMapping Merge(YMapping parent, YMapping child)
    {
        var entries = new List<KeyValuePair<YScalar, YNode>>();
        foreach (var (key, value) in parent.Entries)
        {
            if (key.Value == "extends") continue;
            var over = child[key.Value];
            entries.Add(new(child.KeyNode(key.Value) ?? key, over switch
            {
                null => value,
                YMapping cm when value is YMapping pm && !FormChanges(pm, cm) && cm["value"] is null => Merge(pm, cm),
                _ => over,
            }));
        }
        foreach (var (key, value) in child.Entries)
            if (key.Value != "extends" && parent[key.Value] is null) entries.Add(new(key, value));
        return new YMapping(entries, child.At);
    }
}
