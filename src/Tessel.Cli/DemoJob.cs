namespace Tessel.Cli;

/// <summary>The bundled demo job (patterns/saddle-canopy.json, embedded at build time) so that
/// <c>tessel build</c> works from any folder.</summary>
public static class DemoJob
{
    /// <summary>Resource name given in Tessel.Cli.csproj.</summary>
    public const string ResourceName = "Tessel.Cli.saddle-canopy.json";

    /// <summary>The demo job text.</summary>
    public static string Text()
    {
        using var stream = typeof(DemoJob).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"embedded demo job {ResourceName} is missing from the build");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }
}
