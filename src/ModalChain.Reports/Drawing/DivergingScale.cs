using System.Collections.Immutable;
using System.Globalization;

namespace ModalChain.Reports.Drawing;

/// <summary>The stepped two-sided colour scale of the shape maps: blue for negative values, vermillion for positive, pale near zero.</summary>
/// <remarks>
/// Values in [−1, 1] (a mode shape normalised to max |φ| = 1) fall into <see cref="BandCount"/> equal bands of width
/// 2 / <see cref="BandCount"/>; zero opens the first positive band. Each band's colour is mixed channel by channel (in
/// the gamma-encoded sRGB values, whose steps look roughly even) between a pale centre and the end colour of its side at
/// the band's mid value, so every channel, and with them the luminance, moves one way from the centre to each end: the
/// colour darkens steadily with |value| and the sign is read from the hue. The end colours are deeper shades of the blue
/// and vermillion of <see cref="Palette"/>, which stay apart for colour-blind readers; steps rather than a continuous ramp
/// let a reader match a node to the colour bar by eye and keep the drawing compact.
/// </remarks>
public static class DivergingScale
{
    /// <summary>Number of bands over [−1, 1] (half of them negative).</summary>
    public const int BandCount = 16;

    private static readonly (double R, double G, double B) Negative = (0x18, 0x52, 0xAA);
    private static readonly (double R, double G, double B) Centre = (0xF4, 0xF3, 0xEE);
    private static readonly (double R, double G, double B) Positive = (0xC4, 0x3E, 0x12);

    /// <summary>The band colours, lowest values first, as "#RRGGBB".</summary>
    public static readonly ImmutableArray<string> Colours = [.. Enumerable.Range(0, BandCount).Select(BandColour)];

    /// <summary>The band of <paramref name="value"/> (clamped to [−1, 1]): 0 for the lowest values, <see cref="BandCount"/> − 1 for the highest.</summary>
    /// <remarks>
    /// A value within <see cref="EdgeSnap"/> (in band widths) of a band edge counts as on the edge, so the band above it:
    /// a shape value the closed form puts on an edge (½ at the corners of a square grid's first mode) comes out of an
    /// eigen solver a few ulps to either side, and nodes that symmetry makes equal must still share one colour whichever
    /// solver ran.
    /// </remarks>
    public static int Band(double value)
    {
        if (double.IsNaN(value)) throw new ArgumentException("A shape value is NaN.", nameof(value));
        var v = Math.Clamp(value, -1, 1);
        var position = (v + 1) / 2 * BandCount;
        var edge = Math.Round(position);
        if (Math.Abs(position - edge) < EdgeSnap) position = edge;
        return Math.Min(BandCount - 1, (int)Math.Floor(position));
    }

    /// <summary>How close to a band edge (in band widths) a value counts as on it: far above an eigen solver's round-off (1e-12 relative), far below anything a reader could see.</summary>
    public const double EdgeSnap = 1e-9;

    /// <summary>The colour of <paramref name="value"/>.</summary>
    public static string ColourOf(double value) => Colours[Band(value)];

    /// <summary>The lower edge of band <paramref name="band"/> (−1 for band 0).</summary>
    public static double LowerEdge(int band) => -1 + 2.0 * band / BandCount;

    /// <summary>The value the colour of band <paramref name="band"/> is mixed at (its middle).</summary>
    public static double MidValue(int band) => LowerEdge(band) + 1.0 / BandCount;

    /// <summary>Relative luminance of a "#RRGGBB" colour (ITU-R BT.709 weights on linear sRGB), 0 black to 1 white.</summary>
    public static double Luminance(string colour)
    {
        ArgumentNullException.ThrowIfNull(colour);
        var (r, g, b) = Parse(colour);
        return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    }

    private static string BandColour(int band)
    {
        var v = MidValue(band);
        var end = v < 0 ? Negative : Positive;
        var t = Math.Abs(v);
        return Hex(Centre.R + t * (end.R - Centre.R), Centre.G + t * (end.G - Centre.G), Centre.B + t * (end.B - Centre.B));
    }

    private static (double, double, double) Parse(string colour)
    {
        if (colour.Length != 7 || colour[0] != '#') throw new ArgumentException($"'{colour}' is not #RRGGBB.", nameof(colour));
        int Channel(int at) => int.Parse(colour.AsSpan(at, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture);
        return Linear(Channel(1), Channel(3), Channel(5));
    }

    private static (double, double, double) Linear(int r, int g, int b) => (ToLinear(r), ToLinear(g), ToLinear(b));

    // sRGB transfer function (IEC 61966-2-1).
    private static double ToLinear(int channel)
    {
        var c = channel / 255.0;
        return c <= 0.04045 ? c / 12.92 : Math.Pow((c + 0.055) / 1.055, 2.4);
    }

    private static string Hex(double r, double g, double b) =>
        string.Create(CultureInfo.InvariantCulture, $"#{(int)Math.Round(r):X2}{(int)Math.Round(g):X2}{(int)Math.Round(b):X2}");
}
