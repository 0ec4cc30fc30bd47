using Briefwright.Model.Inputs;
using Briefwright.Scenario.Binding;
using Briefwright.Scenario.Diagnostics;
using Briefwright.Scenario.Yaml;

namespace Briefwright.Scenario;

/// <summary>The outcome of loading a scenario: the document, or every problem found, with the sources to show them.</summary>
public sealed record LoadResult(ScenarioDocument? Document, IReadOnlyList<Diagnostic> Problems, SourceSet Sources)
{
    public bool Ok => Document is not null && Problems.Count == 0;
}

/// <summary>
/// Loads a scenario file: reads YAML with positions, follows <c>extends</c> (deep merge, child wins, paths relative
/// to the file that names them, cycles reported), reads life tables, then binds and validates.
/// </summary>
public sealed class ScenarioLoader(ISourceReader reader)
{
    public const int MaxExtendsDepth = 16;

    public LoadResult Load(string path)
    {
        var sources = new SourceSet();
        var problems = new List<Diagnostic>();
        var files = new List<string>();
        var root = LoadTree(path, new List<string>(), sources, problems, files, null);
        if (root is null || problems.Count > 0) return new LoadResult(null, problems, sources);

        var ctx = new BindContext();
        var binder = new ScenarioBinder(ctx, (file, at, fieldPath) => LoadLifeTable(file, at, fieldPath, ctx, sources, files));
        var document = binder.Bind(root, files);
        return new LoadResult(document is null ? null : document with { InputHash = sources.Hash() }, ctx.Problems, sources);
    }

    private TabulatedSurvival? LoadLifeTable(string file, SourceSpan at, string fieldPath, BindContext ctx, SourceSet sources, List<string> files)
    {
        string full = Resolve(at.File, file);
        if (!reader.TryRead(full, out string text, out string error))
        {
            ctx.Report(at, fieldPath, $"cannot read the life table ({error})", $"'{file}'");
            return null;
        }
        sources.Add(full, text);
        files.Add(full);
        return LifeTableReader.Read(full, text, fieldPath, ctx);
    }

    private YMapping? LoadTree(string path, List<string> chain, SourceSet sources, List<Diagnostic> problems, List<string> files, (SourceSpan At, string Value)? namedBy)
    {
        string key = Path.GetFullPath(path);
        if (chain.Contains(key))
        {
            var cycle = string.Join(" → ", chain.Skip(chain.IndexOf(key)).Append(key).Select(Path.GetFileName));
            problems.Add(new Diagnostic(namedBy!.Value.At, "extends", $"scenarios extend each other in a cycle ({cycle})", $"'{namedBy.Value.Value}'"));
            return null;
        }
        if (chain.Count >= MaxExtendsDepth)
        {
            problems.Add(new Diagnostic(namedBy!.Value.At, "extends", $"more than {MaxExtendsDepth} levels of extends", $"'{namedBy.Value.Value}'"));
            return null;
        }
        if (!reader.TryRead(path, out string text, out string error))
        {
            if (namedBy is { } by) problems.Add(new Diagnostic(by.At, "extends", $"cannot read the extended scenario ({error})", $"'{by.Value}'"));
            else problems.Add(new Diagnostic(new SourceSpan(path, 1, 1), "", $"cannot read the scenario ({error})", null));
            return null;
        }
        sources.Add(path, text);
        files.Add(path);
        var (node, readProblems) = YamlTreeReader.Read(path, text);
        problems.AddRange(readProblems);
        if (node is null) return null;
        if (node is not YMapping map)
        {
            problems.Add(new Diagnostic(node.At, "", "a scenario must be a mapping with the sections brief, demography, human_capital, production and options", node.Kind));
            return null;
        }
        if (map["extends"] is not { } ext) return map;
        if (ext is not YScalar { IsNull: false } parentName)
        {
            problems.Add(new Diagnostic(ext.At, "extends", "must be the path of another scenario file", ext.Kind));
            return null;
        }
        string parentPath = Resolve(path, parentName.Value);
        chain.Add(key);
        var parent = LoadTree(parentPath, chain, sources, problems, files, (parentName.At, parentName.Value));
        chain.RemoveAt(chain.Count - 1);
        return parent is null ? null : Merge(parent, map);
    }

    /// <summary>A path named inside <paramref name="from"/>, relative to that file's folder, with "." and ".." folded away.</summary>
    public static string Resolve(string from, string relative)
    {
        string combined = Path.Combine(Path.GetDirectoryName(from) ?? "", relative);
        if (Path.IsPathRooted(combined)) return Path.GetFullPath(combined);
        string cwd = Directory.GetCurrentDirectory();
        return Path.GetRelativePath(cwd, Path.GetFullPath(combined, cwd));
    }

    /// <summary>A section that switches its <c>form</c> (say, from gompertz_makeham to life_table) is replaced, not merged.</summary>
    private static bool FormChanges(YMapping parent, YMapping child) =>
        child["form"] is YScalar c && (parent["form"] is not YScalar p || p.Value != c.Value);

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
