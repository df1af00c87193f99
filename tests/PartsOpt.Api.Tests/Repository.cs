namespace PartsOpt.Api.Tests;

/// <summary>The checkout the tests run from: committed files (openapi/, docs/examples/) are read from it.</summary>
internal static class Repository
{
    public static string Root { get; } = Find();

    private static string Find()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "PartsOpt.sln")))
                return dir.FullName;
        }

        throw new InvalidOperationException("PartsOpt.sln not found above " + AppContext.BaseDirectory);
    }
}
