using ModalChain.Core.Analyses.Harmonic;
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
        (DisplayUnits.AngularOf(ResponseQuantity.Displacement), DisplayUnits.AngularOf(ResponseQuantity.Velocity), DisplayUnits.AngularOf(ResponseQuantity.Acceleration));
}
