namespace Briefwright.TestSupport;

/// <summary>The repository's root folder (the one holding ReportBuilder.sln), found by walking up from the test
/// assembly's folder. One copy, compiled into every test project by tests/Directory.Build.props.</summary>
internal static class RepositoryRoot
{
    public static string Path { get; } = Find();

    private static string Find()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(System.IO.Path.Combine(dir.FullName, "ReportBuilder.sln")))
            dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("Repository root (ReportBuilder.sln) not found.");
    }
}
