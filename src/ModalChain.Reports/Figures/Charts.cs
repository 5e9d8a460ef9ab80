using System.Globalization;
using ModalChain.Reports.Drawing;
using OxyPlot;
using OxyPlot.Axes;
using OxyPlot.Series;

namespace ModalChain.Reports.Figures;

/// <summary>Shared look of the x-y charts: fixed font, Okabe-Ito colours with distinct dashes, axis titles with units.</summary>
public static class Charts
{
    /// <summary>Sets the fixed font family and sizes on <paramref name="model"/> and its axes, and the invariant culture for its tick labels.</summary>
    public static void ApplyFont(PlotModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        // OxyPlot formats tick labels in the current culture unless told otherwise: 0,0001 under a German locale.
        model.Culture = CultureInfo.InvariantCulture;
        model.DefaultFont = Scene.FontFamily;
        model.DefaultFontSize = 11;
        model.TitleFontSize = 14;
        model.SubtitleFontSize = 11;
        model.TitleFontWeight = FontWeights.Bold;
        model.TitleHorizontalAlignment = TitleHorizontalAlignment.CenteredWithinView;
        model.Background = OxyColors.White;
        model.PlotAreaBorderColor = OxyColor.Parse(Palette.Black);
    }

    /// <summary>A new chart with a title, subtitle and the shared look.</summary>
    public static PlotModel Create(string title, string? subtitle = null)
    {
        var model = new PlotModel { Title = title, Subtitle = subtitle };
        ApplyFont(model);
        return model;
    }

    /// <summary>A linear axis with a title that names the unit, e.g. "Frequency (Hz)".</summary>
    public static LinearAxis Linear(AxisPosition position, string title, double? minimum = null, double? maximum = null) => Grid(new LinearAxis
    {
        Position = position,
        Title = title,
        Minimum = minimum ?? double.NaN,
        Maximum = maximum ?? double.NaN,
    });

    /// <summary>A logarithmic axis with a title that names the unit.</summary>
    public static LogarithmicAxis Logarithmic(AxisPosition position, string title) => Grid(new LogarithmicAxis { Position = position, Title = title });

    /// <summary>Colour and dash of series <paramref name="index"/>, cycling through <see cref="Palette.Series"/>.</summary>
    public static void Style(LineSeries series, int index)
    {
        ArgumentNullException.ThrowIfNull(series);
        var i = index % Palette.Series.Length;
        series.Color = OxyColor.Parse(Palette.Series[i]);
        series.StrokeThickness = i == 0 ? 2 : 1.6;
        if (Palette.Dashes[i] is { } dash)
        {
            series.LineStyle = LineStyle.Solid;
            series.Dashes = [.. dash];
        }
    }

    private static T Grid<T>(T axis) where T : Axis
    {
        axis.MajorGridlineStyle = LineStyle.Solid;
        axis.MajorGridlineColor = OxyColor.FromAColor(40, OxyColors.Black);
        axis.MinorGridlineStyle = LineStyle.Solid;
        axis.MinorGridlineColor = OxyColor.FromAColor(14, OxyColors.Black);
        axis.TitleFontSize = 11.5;
        axis.AxislineStyle = LineStyle.Solid;
        return axis;
    }
}
