using System.Collections.Immutable;

namespace ModalChain.Reports.Drawing;

/// <summary>Colours and line styles of every figure, chosen to stay distinct for colour-blind readers and in black-and-white print.</summary>
/// <remarks>
/// Colours are the eight-colour palette of Okabe and Ito, "Color Universal Design: how to make figures and presentations
/// that are friendly to colorblind people" (J*FLY, 2008), also recommended by B. Wong, "Points of view: Color blindness",
/// Nature Methods 8, 441 (2011). Each series also has its own dash pattern and width, so a greyscale print still
/// tells them apart.
/// </remarks>
public static class Palette
{
    public const string Black = "#000000";
    public const string Orange = "#E69F00";
    public const string SkyBlue = "#56B4E9";
    public const string BluishGreen = "#009E73";
    public const string Yellow = "#F0E442";
    public const string Blue = "#0072B2";
    public const string Vermillion = "#D55E00";
    public const string ReddishPurple = "#CC79A7";
    public const string Grey = "#6E6E6E";

    /// <summary>Series colours in the order x-y charts use them (yellow left out: too light on white paper).</summary>
    public static readonly ImmutableArray<string> Series = [Blue, Vermillion, BluishGreen, ReddishPurple, Orange, SkyBlue, Black];

    /// <summary>Dash patterns in user units paired with <see cref="Series"/>; null is a solid line.</summary>
    public static readonly ImmutableArray<ImmutableArray<double>?> Dashes =
        [null, ImmutableArray.Create(7.0, 4.0), ImmutableArray.Create(2.0, 3.0), ImmutableArray.Create(9.0, 3.0, 2.0, 3.0),
         ImmutableArray.Create(4.0, 2.0), ImmutableArray.Create(12.0, 4.0), ImmutableArray.Create(1.0, 2.0)];

    /// <summary>The undeformed network: thin, dashed, grey.</summary>
    public static readonly Pen Undeformed = new(Grey, 1.2, ImmutableArray.Create(5.0, 3.0));

    /// <summary>The deformed shape: solid, heavier, blue.</summary>
    public static readonly Pen Deformed = new(Blue, 2.0);

    /// <summary>The network drawing itself (no mode): solid black.</summary>
    public static readonly Pen Structure = new(Black, 1.4);

    /// <summary>Ground and support symbols.</summary>
    public static readonly Pen Support = new(Black, 1.2);
}
