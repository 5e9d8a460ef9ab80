using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;

namespace ModalChain.Core.Tests.Solvers;

public class MatrixExponentialTests
{
    [Theory]
    [InlineData(0.3)]
    [InlineData(40.0)]
    public void RotationGenerator_GivesARotation(double angle)
    {
        // exp([[0, θ], [−θ, 0]]) = [[cos θ, sin θ], [−sin θ, cos θ]] (closed form; common practice).
        var a = Matrix<double>.Build.DenseOfArray(new[,] { { 0, angle }, { -angle, 0 } });
        var expected = Matrix<double>.Build.DenseOfArray(new[,] { { Math.Cos(angle), Math.Sin(angle) }, { -Math.Sin(angle), Math.Cos(angle) } });
        NumericAssert.Close(expected, MatrixExponential.Compute(a), Tolerance.Abs(1e-12), "e^A");
    }

    [Fact]
    public void Diagonal_GivesExponentialsOfTheEntries()
    {
        var a = Matrix<double>.Build.DenseOfDiagonalArray([-50.0, 0.0, 2.5]);
        var e = MatrixExponential.Compute(a);
        NumericAssert.Close(Math.Exp(-50), e[0, 0], Tolerance.Rel(1e-12), "e^−50");
        NumericAssert.Close(1, e[1, 1], Tolerance.Rel(1e-14), "e^0");
        NumericAssert.Close(Math.Exp(2.5), e[2, 2], Tolerance.Rel(1e-13), "e^2.5");
    }

    [Fact]
    public void JordanBlock_GivesTheShiftedExponential()
    {
        // exp(λI + N) = e^λ (I + N) for the nilpotent N = [[0, 1], [0, 0]].
        var a = Matrix<double>.Build.DenseOfArray(new[,] { { -3.0, 1.0 }, { 0.0, -3.0 } });
        var e = MatrixExponential.Compute(a);
        NumericAssert.Close(Matrix<double>.Build.DenseOfArray(new[,] { { Math.Exp(-3), Math.Exp(-3) }, { 0, Math.Exp(-3) } }), e,
            Tolerance.Abs(1e-14), "e^A");
    }

    [Fact]
    public void RandomMatrix_TimesExponentialOfItsNegative_IsIdentity()
    {
        var random = new Random(11);
        var a = Matrix<double>.Build.Dense(6, 6, (_, _) => 4 * (random.NextDouble() - 0.5));
        var product = MatrixExponential.Compute(a) * MatrixExponential.Compute(-a);
        NumericAssert.Close(Matrix<double>.Build.DenseIdentity(6), product, Tolerance.Abs(1e-10), "e^A e^−A");
    }
}
