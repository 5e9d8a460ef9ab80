using ModalChain.Core.Model;
using ModalChain.Reports.Units;

namespace ModalChain.Cli.Formatting;

/// <summary>
/// Rotations of plane and 3d models in the motion tables: a rotation (<c>skid.ry</c>) is an angle, not a length, so its
/// rows go into a table of their own in mrad, mrad/s and rad/s² (the same in SI and imperial display), never under a
/// length column.
/// </summary>
internal static class RotationRows
{
    /// <summary>mrad, mrad/s and rad/s² for angle, angular velocity and angular acceleration.</summary>
    public static readonly (DisplayUnit Angle, DisplayUnit Rate, DisplayUnit Acceleration) Units =
        (new DisplayUnit("mrad", "mrad", 1e-3), new DisplayUnit("mrad/s", "mrad/s", 1e-3), new DisplayUnit("rad/s²", "rad/s^2", 1));

    /// <summary>True when <paramref name="label"/> is a rotation DOF label of a plane or 3d model.</summary>
    public static bool Is(Network network, string label) =>
        network.Space != ModelSpace.Line && (label.EndsWith(".rx", StringComparison.Ordinal) || label.EndsWith(".ry", StringComparison.Ordinal) || label.EndsWith(".rz", StringComparison.Ordinal));
}
