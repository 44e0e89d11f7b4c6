using System.Reflection;

namespace Placement;

/// <summary>Facts about this build of the library.</summary>
public static class LibraryInfo
{
    /// <summary>The library's informational version (e.g. <c>0.1.0</c>).</summary>
    public static string Version { get; } =
        typeof(LibraryInfo).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion?.Split('+')[0]
        ?? typeof(LibraryInfo).Assembly.GetName().Version?.ToString()
        ?? "0.0.0";
}
