using Microsoft.CodeAnalysis;
using Microsoft.CodeAnalysis.CSharp;
using Microsoft.CodeAnalysis.CSharp.Syntax;
using Microsoft.CodeAnalysis.Text;

namespace Briefwright.Cli.Tests;

/// <summary>
/// Architecture rule on the source text: no method, constructor, operator, accessor or local function under src/ is
/// longer than <see cref="MaxLines"/> lines, counted from the first line of its signature (attributes left out) to
/// its closing brace (or the end of its expression body). A longer one is split into named steps. The sources are
/// parsed with the C# compiler's own parser, so strings, comments and nested braces count as they should.
/// </summary>
public class MethodLengthTests
{
    private const int MaxLines = 60;

    /// <summary>Methods allowed to stay longer while another piece of work splits them ("file: Type.Method" → why).
    /// Empty: keep it so. An entry that is no longer long fails
    /// <see cref="The_allow_list_names_only_methods_that_are_still_long"/>.</summary>
    private static readonly Dictionary<string, string> Allowed = new();

    [Fact]
    public void No_method_under_src_is_longer_than_60_lines()
    {
        var src = Path.Combine(RepositoryRoot.Path, "src");
        var offenders = new List<string>();
        foreach (var path in Directory.EnumerateFiles(src, "*.cs", SearchOption.AllDirectories))
        {
            string rel = Path.GetRelativePath(RepositoryRoot.Path, path).Replace('\\', '/');
            if (rel.Contains("/obj/") || rel.Contains("/bin/")) continue;
            foreach (var (name, line, lines) in LongMethods(File.ReadAllText(path), MaxLines))
                if (!Allowed.ContainsKey($"{rel}: {name}")) offenders.Add($"{rel}:{line}: {name} has {lines} lines");
        }
        Assert.True(offenders.Count == 0, "Split these into named steps:\n" + string.Join("\n", offenders));
    }

    [Fact]
    public void The_allow_list_names_only_methods_that_are_still_long()
    {
        foreach (var key in Allowed.Keys)
        {
            int colon = key.IndexOf(": ", StringComparison.Ordinal);
            var (rel, name) = (key[..colon], key[(colon + 2)..]);
            var text = File.ReadAllText(Path.Combine(RepositoryRoot.Path, rel));
            Assert.Contains(LongMethods(text, MaxLines), m => m.Name == name);
        }
    }

    [Fact]
    public void The_count_runs_from_signature_to_closing_brace()
    {
        static string Method(string name, int bodyLines) =>
            "[Obsolete]\n[Pure]\nstatic int " + name + "()\n{\n" +
            string.Concat(Enumerable.Repeat("    s += \"}\"; // }\n", bodyLines)) + "}\n";
        // Signature, braces and body: 57 body lines make 60 (allowed), 58 make 61. Attributes do not count, and braces
        // in strings or comments do not end the method. G's signature is on line 70.
        string code = "class C\n{\n" + Method("F", 57) + "}\nclass D\n{\n" + Method("G", 58) + "}\n";
        Assert.Equal([("D.G", 70, 61)], LongMethods(code, 60));
    }

    [Fact]
    public void Local_functions_constructors_and_accessors_count_on_their_own()
    {
        string body = string.Concat(Enumerable.Repeat("        x++;\n", 61));
        string code = "class C\n{\n    C()\n    {\n" + body + "    }\n" +
                      "    int P\n    {\n        get\n        {\n" + body + "        }\n    }\n" +
                      "    void M()\n    {\n        void Local()\n        {\n" + body + "        }\n    }\n}\n";
        var names = LongMethods(code, 60).Select(m => m.Name).ToList();
        Assert.Equal(["C.C", "C.get", "C.M", "C.Local"], names);
    }

    /// <summary>Name ("Type.Method"), first line (1-based) and line count of every member body in
    /// <paramref name="code"/> longer than <paramref name="max"/> lines.</summary>
    internal static IEnumerable<(string Name, int Line, int Lines)> LongMethods(string code, int max)
    {
        var tree = CSharpSyntaxTree.ParseText(code);
        foreach (var node in tree.GetRoot().DescendantNodes())
        {
            (SyntaxList<AttributeListSyntax> attributes, string? name) = node switch
            {
                MethodDeclarationSyntax m => (m.AttributeLists, m.Identifier.Text),
                ConstructorDeclarationSyntax c => (c.AttributeLists, c.Identifier.Text),
                DestructorDeclarationSyntax d => (d.AttributeLists, "~" + d.Identifier.Text),
                OperatorDeclarationSyntax o => (o.AttributeLists, "operator " + o.OperatorToken.Text),
                ConversionOperatorDeclarationSyntax v => (v.AttributeLists, "operator " + v.Type),
                LocalFunctionStatementSyntax f => (f.AttributeLists, f.Identifier.Text),
                AccessorDeclarationSyntax a => (a.AttributeLists, a.Keyword.Text),
                _ => (default, null),
            };
            if (name is null) continue;
            var first = attributes.Count == 0 ? node.GetFirstToken() : attributes.Last().GetLastToken().GetNextToken();
            var span = tree.GetLineSpan(TextSpan.FromBounds(first.SpanStart, node.Span.End));
            int lines = span.EndLinePosition.Line - span.StartLinePosition.Line + 1;
            string owner = node.Ancestors().OfType<BaseTypeDeclarationSyntax>().FirstOrDefault()?.Identifier.Text ?? "";
            if (lines > max) yield return ($"{owner}.{name}", span.StartLinePosition.Line + 1, lines);
        }
    }
}
