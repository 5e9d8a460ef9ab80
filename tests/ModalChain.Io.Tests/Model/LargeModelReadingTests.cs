using System.Globalization;
using System.Text;
using ModalChain.Core.Assembly;
using ModalChain.Core.Model;
using ModalChain.Io.Model;
using ModalChain.TestSupport;

namespace ModalChain.Io.Tests.Model;

/// <summary>
/// A 100,000-mass model written out in full reads, checks and assembles (issue 12 item 6, issue 13 item 4). With the
/// name look-ups of the old reader (a linear scan per spring) this took hours; it is not timed here (the figures are
/// in docs/performance.md), only required to finish, with its counts and matrix entries known by hand.
/// </summary>
public class LargeModelReadingTests
{
    [Fact]
    public void HundredThousandMassGrid_WrittenOutInFull_ReadsChecksAndAssembles()
    {
        const int rows = 250, columns = 400;
        const double k = 5e6, m = 40;
        var result = ModelReader.Read(GridText(rows, columns), "grid.yaml");
        Assert.True(result.Succeeded, string.Join("\n", result.Diagnostics.Take(5)));
        var network = result.Model!.Network;
        Assert.Empty(result.Diagnostics);
        Assert.Equal(rows * columns, network.Masses.Length);
        var edgeSprings = 2 * columns + 2 * (rows - 2); // one spring to ground per edge mass
        var neighbourSprings = rows * (columns - 1) + (rows - 1) * columns;
        Assert.Equal(neighbourSprings + edgeSprings, network.Springs.Length);
        Assert.Empty(Topology.UnsupportedGroups(network));

        var matrices = Assembler.Assemble(network);
        int Dof(int r, int c) => matrices.Dofs.IndexOf($"g-{r}-{c}");
        var K = matrices.Stiffness;
        // Hand-known entries: a corner has two neighbours and one spring to ground, an edge mass three and one, an
        // interior mass four; each neighbour pair is −k.
        NumericAssert.Close(3 * k, K[Dof(1, 1), Dof(1, 1)], Tolerance.Rel(1e-15), "K at a corner");
        NumericAssert.Close(4 * k, K[Dof(1, 7), Dof(1, 7)], Tolerance.Rel(1e-15), "K at an edge mass");
        NumericAssert.Close(4 * k, K[Dof(125, 200), Dof(125, 200)], Tolerance.Rel(1e-15), "K inside");
        NumericAssert.Close(-k, K[Dof(125, 200), Dof(125, 201)], Tolerance.Rel(1e-15), "K between row neighbours");
        NumericAssert.Close(-k, K[Dof(125, 200), Dof(126, 200)], Tolerance.Rel(1e-15), "K between column neighbours");
        NumericAssert.Close(0, K[Dof(125, 200), Dof(126, 201)], Tolerance.Abs(0), "K between diagonal masses");
        NumericAssert.Close(m, matrices.Mass[Dof(250, 400), Dof(250, 400)], Tolerance.Rel(1e-15), "M at the last mass");
        // Identity: K·1 holds the springs to ground alone, so its sum is their total stiffness.
        NumericAssert.Close(edgeSprings * k, K.RowSums().Sum(), Tolerance.Rel(1e-12), "sum of K");
        // Entries: one diagonal per mass and two per neighbour spring.
        Assert.Equal(rows * columns + 2 * neighbourSprings, K.Storage.EnumerateNonZero().Count());
    }

    /// <summary>The model of the benchmark (tests/ModalChain.Benchmarks/ModelFiles.cs): every mass and spring on its own line.</summary>
    private static string GridText(int rows, int columns)
    {
        var inv = CultureInfo.InvariantCulture;
        var text = new StringBuilder(20 << 20);
        text.Append("title: grid\nmasses:\n");
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++)
                text.Append(inv, $"  g-{r}-{c}: {{mass: 40 kg, at: [{0.5 * c}, {0.5 * r}]}}\n");
        text.Append("springs:\n");
        for (var r = 1; r <= rows; r++)
            for (var c = 1; c <= columns; c++)
            {
                if (c < columns) text.Append(inv, $"  h-{r}-{c}: {{between: [g-{r}-{c}, g-{r}-{c + 1}], stiffness: 5 MN/m}}\n");
                if (r < rows) text.Append(inv, $"  v-{r}-{c}: {{between: [g-{r}-{c}, g-{r + 1}-{c}], stiffness: 5 MN/m}}\n");
                if (r == 1 || r == rows || c == 1 || c == columns)
                    text.Append(inv, $"  e-{r}-{c}: {{between: [ground, g-{r}-{c}], stiffness: 5 MN/m}}\n");
            }
        return text.ToString();
    }
}
