using MathNet.Numerics.LinearAlgebra;

namespace ModalChain.Core.Solvers;

/// <summary>The sign convention shared by every eigen solver, so results do not depend on the algorithm.</summary>
internal static class ModeNormalisation
{
    /// <summary>Flips each column so that its largest-magnitude entry is positive (the first such entry on ties within 1e-12).</summary>
    public static void ApplySignConvention(Matrix<double> shapes)
    {
        for (var j = 0; j < shapes.ColumnCount; j++)
        {
            var best = 0;
            var bestAbs = -1.0;
            for (var i = 0; i < shapes.RowCount; i++)
            {
                var a = Math.Abs(shapes[i, j]);
                if (a > bestAbs * (1 + 1e-12)) { best = i; bestAbs = a; }
            }
            if (shapes[best, j] < 0)
                for (var i = 0; i < shapes.RowCount; i++) shapes[i, j] = -shapes[i, j];
        }
    }
}
