using System.Collections.Immutable;

namespace ModalChain.Reports.Drawing;

/// <summary>Many axis-aligned rectangles painted alike, written as one compound SVG path (the cells of a map of thousands of nodes).</summary>
/// <param name="Rects">The rectangles in figure units.</param>
/// <param name="Stroke">Outline pen, or null.</param>
/// <param name="Fill">Fill colour, or null.</param>
public sealed record RectSetShape(ImmutableArray<Rect> Rects, Pen? Stroke, string? Fill) : Shape;
