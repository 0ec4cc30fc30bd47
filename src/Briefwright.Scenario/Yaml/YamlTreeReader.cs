using System.Globalization;
using Briefwright.Scenario.Diagnostics;
using YamlDotNet.Core;
using YamlDotNet.Core.Events;

namespace Briefwright.Scenario.Yaml;

/// <summary>
/// Reads one YAML document into a positioned tree. Rejects what a scenario never needs and an attacker might
/// use: several documents, non-scalar keys, duplicate keys, nesting deeper than <see cref="MaxDepth"/>, more than
/// <see cref="MaxAliases"/> aliases, and files over <see cref="MaxBytes"/>.
/// </summary>
public static class YamlTreeReader
{
    public const int MaxBytes = 1 << 20;
    public const int MaxDepth = 32;
    public const int MaxAliases = 256;

    /// <summary>
    /// Reads <paramref name="text"/>; <paramref name="what"/> ("scenario", "theme") names the kind of file in messages.
    /// </summary>
    public static (YNode? Root, IReadOnlyList<Diagnostic> Problems) Read(string file, string text,
        string what = "scenario")
    {
        var problems = new List<Diagnostic>();
        var start = new SourceSpan(file, 1, 1);
        long bytes = System.Text.Encoding.UTF8.GetByteCount(text);
        if (bytes > MaxBytes)
            return (null, new[] { new Diagnostic(start, "",
                $"file is larger than the limit for a {what} of 1 MiB ({Numbers.Count(MaxBytes)} bytes)",
                $"{Numbers.Count(bytes)} bytes") });
        if (text.Contains('\0'))
            return (null, new[] { new Diagnostic(start, "", "file is binary, not YAML text", "a NUL byte") });
        if (string.IsNullOrWhiteSpace(StripComments(text)))
            return (null, new[] { new Diagnostic(start, "", what == "scenario"
                ? "file is empty; a scenario needs at least the brief, demography and options sections"
                : $"file is empty; a {what} needs at least a name", "nothing") });

        var state = new State(file, new Parser(new StringReader(text)), problems);
        try
        {
            state.Expect<StreamStart>();
            state.Expect<DocumentStart>();
            var root = state.ReadNode(0, "");
            state.Expect<DocumentEnd>();
            if (state.Parser.Current is DocumentStart ds)
                problems.Add(new Diagnostic(state.Span(ds.Start), "",
                    "file holds more than one YAML document; put one scenario per file", "a second '---'"));
            return (problems.Count == 0 ? root : null, problems);
        }
        catch (YamlException ex)
        {
            string reason = ex.InnerException?.Message ?? ex.Message;
            int cut = reason.IndexOf("): ", StringComparison.Ordinal);
            if (reason.StartsWith('(') && cut > 0) reason = reason[(cut + 3)..];
            problems.Add(new Diagnostic(state.Span(ex.Start), "", "YAML syntax error: " + reason.TrimEnd('.'), null));
            return (null, problems);
        }
        catch (LimitException ex)
        {
            problems.Add(ex.Diagnostic);
            return (null, problems);
        }
        catch (InvalidOperationException)
        {
            // YamlDotNet's parser gives up this way when the text ends inside an open flow list or mapping.
            problems.Add(new Diagnostic(state.LastSpan, "",
                "YAML syntax error: the file ends before a list or mapping opened here is closed", null));
            return (null, problems);
        }
    }

    private static string StripComments(string text) =>
        string.Join('\n', text.Split('\n').Select(l => l.TrimStart().StartsWith('#') || l.Trim() == "---" ? "" : l));

    private sealed class LimitException(Diagnostic diagnostic) : Exception(diagnostic.Message)
    {
        public Diagnostic Diagnostic { get; } = diagnostic;
    }

    private sealed class State(string file, IParser parser, List<Diagnostic> problems)
    {
        private readonly Dictionary<string, YNode> anchors = new(StringComparer.Ordinal);
        private int aliases;

        public IParser Parser => parser;

        /// <summary>Where the most recent node started.</summary>
        public SourceSpan LastSpan { get; private set; } = new(file, 1, 1);

        public SourceSpan Span(Mark m) => new(file, (int)Math.Max(1, m.Line), (int)Math.Max(1, m.Column));

        public void Expect<T>() where T : ParsingEvent
        {
            if (parser.Current is null) parser.MoveNext();
            if (parser.Current is not T)
                throw new YamlException(parser.Current!.Start, parser.Current.End, $"expected {typeof(T).Name}");
            parser.MoveNext();
        }

        public YNode ReadNode(int depth, string path)
        {
            var ev = parser.Current ?? throw new InvalidOperationException("The text ended early.");
            if (ev is MappingStart or SequenceStart) LastSpan = Span(ev.Start);
            if (depth > MaxDepth)
                throw new LimitException(new Diagnostic(Span(ev.Start), "",
                    $"nesting is deeper than the limit of {MaxDepth} levels", $"more than {MaxDepth}"));
            parser.MoveNext();
            switch (ev)
            {
                case Scalar s:
                    return ReadScalar(s, path);
                case AnchorAlias a:
                    if (++aliases > MaxAliases)
                        throw new LimitException(new Diagnostic(Span(a.Start), "",
                            $"more than {MaxAliases} aliases", $"*{a.Value}"));
                    if (anchors.TryGetValue(a.Value.Value, out var target)) return target;
                    throw new LimitException(new Diagnostic(Span(a.Start), "",
                        "alias refers to an anchor that is not defined before it", $"*{a.Value}"));
                case SequenceStart ss:
                    return ReadSequence(ss, depth, path);
                case MappingStart ms:
                    return ReadMapping(ms, depth, path);
                default:
                    throw new YamlException(ev.Start, ev.End, $"unexpected {ev.GetType().Name}");
            }
        }

        private YNode ReadScalar(Scalar s, string path)
        {
            // A tag says how to read the scalar: !!str (and the non-specific !) make it text even when it looks
            // like a number; !!int, !!float, !!bool and !!null make it a plain value; any other tag is refused.
            bool quoted = s.Style is ScalarStyle.SingleQuoted or ScalarStyle.DoubleQuoted or ScalarStyle.Literal
                or ScalarStyle.Folded;
            string tag = s.Tag.IsEmpty ? "" : s.Tag.Value;
            switch (tag)
            {
                case "" or "?":
                    break;
                case "!" or "tag:yaml.org,2002:str":
                    quoted = true;
                    break;
                case "tag:yaml.org,2002:int" or "tag:yaml.org,2002:float" or "tag:yaml.org,2002:bool"
                    or "tag:yaml.org,2002:null":
                    quoted = false;
                    break;
                default:
                    problems.Add(new Diagnostic(Span(s.Start), path,
                        "unsupported YAML tag; only !!str, !!int, !!float, !!bool and !!null are read",
                        $"'{BindingText(tag)}'"));
                    break;
            }
            return Remember(s.Anchor, new YScalar(s.Value, quoted, Span(s.Start)));
        }

        private YNode ReadSequence(SequenceStart ss, int depth, string path)
        {
            CheckTag(ss.Tag, "tag:yaml.org,2002:seq", ss.Start, path);
            var items = new List<YNode>();
            while (parser.Current is not SequenceEnd and not null)
                items.Add(ReadNode(depth + 1, $"{path}[{items.Count}]"));
            parser.MoveNext();
            return Remember(ss.Anchor, new YSequence(items, Span(ss.Start)));
        }

        /// <summary>A mapping's entries in order; a key that is not a plain name, or given twice, is reported and
        /// its entry left out.</summary>
        private YNode ReadMapping(MappingStart ms, int depth, string path)
        {
            CheckTag(ms.Tag, "tag:yaml.org,2002:map", ms.Start, path);
            var entries = new List<KeyValuePair<YScalar, YNode>>();
            var seen = new Dictionary<string, YScalar>(StringComparer.Ordinal);
            while (parser.Current is not MappingEnd and not null)
            {
                var keyNode = ReadNode(depth + 1, path);
                string childPath = keyNode is YScalar k ? (path.Length == 0 ? k.Value : $"{path}.{k.Value}") : path;
                var value = ReadNode(depth + 1, childPath);
                if (keyNode is not YScalar key)
                {
                    problems.Add(new Diagnostic(keyNode.At, "", "mapping keys must be plain names", keyNode.Kind));
                    continue;
                }
                if (seen.TryGetValue(key.Value, out var first))
                {
                    problems.Add(new Diagnostic(key.At, childPath,
                        $"duplicate key; first given at line {first.At.Line}", $"'{key.Value}' again"));
                    continue;
                }
                seen[key.Value] = key;
                entries.Add(new(key, value));
            }
            parser.MoveNext();
            return Remember(ms.Anchor, new YMapping(entries, Span(ms.Start)));
        }

        private void CheckTag(TagName tag, string allowed, Mark at, string path)
        {
            if (tag.IsEmpty || tag.Value is "?" or "!" || tag.Value == allowed) return;
            problems.Add(new Diagnostic(Span(at), path,
                "unsupported YAML tag on a list or mapping", $"'{BindingText(tag.Value)}'"));
        }

        private static string BindingText(string tag) =>
            Briefwright.Scenario.Binding.BindContext.Printable(
                tag.StartsWith("tag:yaml.org,2002:", StringComparison.Ordinal)
                    ? "!!" + tag["tag:yaml.org,2002:".Length..]
                    : tag);

        private YNode Remember(AnchorName anchor, YNode node)
        {
            if (!anchor.IsEmpty) anchors[anchor.Value] = node;
            return node;
        }
    }
}
