using ModalChain.Core.Solvers;

namespace ModalChain.Core.Tests.Solvers;

/// <summary>A fact that needs the native LAPACK library: skipped with a reason where it is missing, except under CI.</summary>
/// <remarks>CI installs libopenblas0-pthread (see .ci/run); with CI=true a missing library is a failure, not a skip.</remarks>
public sealed class NativeFactAttribute : FactAttribute
{
    public const string MissingReason = "skipped: libopenblas not found (apt-get install libopenblas0-pthread)";

    public NativeFactAttribute()
    {
        if (!NativeLapack.IsAvailable && !RequiredHere) Skip = MissingReason;
    }

    /// <summary>True under CI, where the library must be present.</summary>
    public static bool RequiredHere => string.Equals(Environment.GetEnvironmentVariable("CI"), "true", StringComparison.OrdinalIgnoreCase);

    /// <summary>Fails a native test with a clear message when the library is missing (only reached under CI).</summary>
    public static void AssertLibraryLoaded() =>
        Assert.True(NativeLapack.IsAvailable, $"CI=true but no native LAPACK library loaded (tried {string.Join(", ", NativeLapack.Candidates)}).");
}

/// <summary>A theory that needs the native LAPACK library; see <see cref="NativeFactAttribute"/>.</summary>
public sealed class NativeTheoryAttribute : TheoryAttribute
{
    public NativeTheoryAttribute()
    {
        if (!NativeLapack.IsAvailable && !NativeFactAttribute.RequiredHere) Skip = NativeFactAttribute.MissingReason;
    }
}
