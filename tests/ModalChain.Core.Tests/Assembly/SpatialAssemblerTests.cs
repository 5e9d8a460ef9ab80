using MathNet.Numerics.LinearAlgebra;
using ModalChain.Core.Assembly;
using ModalChain.Core.Dofs;
using ModalChain.Core.Model;
using ModalChain.Core.Solvers;
using ModalChain.TestSupport;
using static ModalChain.Core.Tests.SpatialNetworks;

namespace ModalChain.Core.Tests.Assembly;

/// <summary>
/// Assembly of plane and 3d networks through the rigid-body transformation u_p = u_c + θ × (p − c) of each element end
/// (any dynamics text; the matrices of §10 of REFERENCES.md follow from it by hand).
/// </summary>
public class SpatialAssemblerTests
{
    private static int I(StructuralMatrices m, string node, Direction d) => m.Dofs.IndexOf(node, d);

    [Fact]
    public void RigidBar_BouncePitchBlockIsTheClosedForm()
    {
        // REFERENCES.md §10 (Rao, two-DOF chapter [from memory]; values recomputed): K = [[k1+k2, k2l2−k1l1], [·, k1l1²+k2l2²]].
        var m = Assembler.Assemble(Bar());
        var (z, ry, x) = (I(m, "bar", Direction.Z), I(m, "bar", Direction.Ry), I(m, "bar", Direction.X));
        var k = m.DenseStiffness();
        NumericAssert.Close(KFront + KRear, k[z, z], Tolerance.Abs(0), "K_zz");
        NumericAssert.Close(KRear * LRear - KFront * LFront, k[z, ry], Tolerance.Abs(1e-9), "K_z,ry");
        NumericAssert.Close(k[z, ry], k[ry, z], Tolerance.Abs(0), "symmetry");
        NumericAssert.Close(KFront * LFront * LFront + KRear * LRear * LRear, k[ry, ry], Tolerance.Abs(1e-9), "K_ry,ry");
        NumericAssert.Close(2 * KSurge, k[x, x], Tolerance.Abs(0), "K_xx");
        NumericAssert.Close(0, k[x, z], Tolerance.Abs(0), "K_xz");
        NumericAssert.Close(0, k[x, ry], Tolerance.Abs(0), "surge springs at the centre's height do not pitch");
        NumericAssert.Close(Matrix<double>.Build.DenseOfDiagonalArray([BarMass, BarMass, BarInertia]), m.DenseMass(), Tolerance.Abs(0), "M");
        Assert.True(m.MassIsDiagonal);
    }

    [Fact]
    public void RigidBar_FrequenciesMatchThePublishedValues()
    {
        // REFERENCES.md §10: ω = 5.8593 and 9.4341 rad/s; recomputed from the 2×2 closed form to 1e-10.
        var m = Assembler.Assemble(Bar());
        var solution = new DenseGeneralizedEigen().Solve(m.Stiffness, m.Mass, 3, m.MassIsDiagonal);
        var (low, high) = TwoByTwo(KFront + KRear, KRear * LRear - KFront * LFront, KFront * LFront * LFront + KRear * LRear * LRear, BarMass, BarInertia);
        var expected = new[] { low, high, 2 * KSurge / BarMass }.Order().ToArray();
        NumericAssert.Close(expected, solution.EigenValues, Tolerance.Rel(1e-10), "ω² against the 2×2 closed form");
        NumericAssert.Close(5.8593, Math.Sqrt(low), Tolerance.Abs(1e-4), "ω1 (REFERENCES.md §10)");
        NumericAssert.Close(9.4341, Math.Sqrt(high), Tolerance.Abs(1e-4), "ω2 (REFERENCES.md §10)");
    }

    [Fact]
    public void RigidBar_In3dWithZOnly_KeepsTheSameBouncePitchBlock()
    {
        var plane = Assembler.Assemble(Bar(ModelSpace.Plane, surgeSprings: false));
        var space = Assembler.Assemble(Bar(ModelSpace.ThreeD, surgeSprings: false));
        Assert.Equal(6, space.Size);
        foreach (var (p, q) in new[] { (Direction.Z, Direction.Z), (Direction.Z, Direction.Ry), (Direction.Ry, Direction.Ry) })
            NumericAssert.Close(plane.DenseStiffness()[I(plane, "bar", p), I(plane, "bar", q)], space.DenseStiffness()[I(space, "bar", p), I(space, "bar", q)],
                Tolerance.Abs(0), $"K[{p},{q}]");
        var k = space.DenseStiffness();
        NumericAssert.Close(0, k.RowSums().Select(Math.Abs).Where((_, i) => i != I(space, "bar", Direction.Z) && i != I(space, "bar", Direction.Ry)).Sum(),
            Tolerance.Abs(0), "z springs on the x axis give no stiffness in x, y, rx or rz");
    }

    [Fact]
    public void SymmetricBlockOnFourMounts_MatchesTheClosedForms()
    {
        // REFERENCES.md §10 (Harris, vibration isolation chapter [from memory]; derivable by hand): bounce 4k_z/m,
        // yaw 4k_h(a²+b²)/J_z, x–ry and y–rx pairs from their 2×2 problems.
        const double mass = 1200, a = 0.8, b = 0.5, h = 0.6, kh = 3e5, kz = 9e5;
        var inertia = new InertiaMatrix(250, 400, 520);
        var m = Assembler.Assemble(Block(mass, inertia, a, b, h, kh, kz));
        var solution = new DenseGeneralizedEigen().Solve(m.Stiffness, m.Mass, 6, m.MassIsDiagonal);
        var xry = TwoByTwo(4 * kh, -4 * kh * h, 4 * kz * a * a + 4 * kh * h * h, mass, inertia.Yy);
        var yrx = TwoByTwo(4 * kh, 4 * kh * h, 4 * kz * b * b + 4 * kh * h * h, mass, inertia.Xx);
        var expected = new[] { 4 * kz / mass, 4 * kh * (a * a + b * b) / inertia.Zz, xry.Low, xry.High, yrx.Low, yrx.High }.Order().ToArray();
        NumericAssert.Close(expected, solution.EigenValues, Tolerance.Rel(1e-10), "ω²");
        var k = m.DenseStiffness();
        NumericAssert.Close(-4 * kh * h, k[I(m, "block", Direction.X), I(m, "block", Direction.Ry)], Tolerance.Rel(1e-14), "K_x,ry");
        NumericAssert.Close(4 * kh * h, k[I(m, "block", Direction.Y), I(m, "block", Direction.Rx)], Tolerance.Rel(1e-14), "K_y,rx");
    }

    [Fact]
    public void BlockWithCentreOfMassInTheMountPlane_Decouples()
    {
        // h = 0: sway and rocking separate (REFERENCES.md §10): ω² = 4k_h/m (twice), 4k_z a²/J_y, 4k_z b²/J_x.
        const double mass = 1200, a = 0.8, b = 0.5, kh = 3e5, kz = 9e5;
        var inertia = new InertiaMatrix(250, 400, 520);
        var m = Assembler.Assemble(Block(mass, inertia, a, b, 0, kh, kz));
        var k = m.DenseStiffness();
        NumericAssert.Close(0, k[I(m, "block", Direction.X), I(m, "block", Direction.Ry)], Tolerance.Abs(0), "K_x,ry");
        NumericAssert.Close(0, k[I(m, "block", Direction.Y), I(m, "block", Direction.Rx)], Tolerance.Abs(0), "K_y,rx");
        var solution = new DenseGeneralizedEigen().Solve(m.Stiffness, m.Mass, 6, m.MassIsDiagonal);
        var expected = new[] { 4 * kz / mass, 4 * kh * (a * a + b * b) / inertia.Zz, 4 * kh / mass, 4 * kh / mass, 4 * kz * a * a / inertia.Yy, 4 * kz * b * b / inertia.Xx }
            .Order().ToArray();
        NumericAssert.Close(expected, solution.EigenValues, Tolerance.Rel(1e-10), "ω²");
    }

    [Fact]
    public void AxialSpring_EqualsItsComponentsAlongTheLine()
    {
        // An axial spring k along unit n gives k n nᵀ on the translations of a point mass (common practice).
        var n = new Point3(2, -1, 2);
        var length = n.Length;
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 10) { Location = new Point3(1, 1, 1) });
        b.AddSupport(new Support("anchor") { Location = new Point3(1, 1, 1) + n });
        b.AddSpring(new Spring("strut", "m", "anchor", 7e3) { Axial = true });
        var k = Assembler.Assemble(b.Build()).DenseStiffness();
        var u = new[] { n.X / length, n.Y / length, n.Z / length };
        NumericAssert.Close(Matrix<double>.Build.Dense(3, 3, (i, j) => 7e3 * u[i] * u[j]), k, Tolerance.Abs(1e-12), "K = k n nᵀ");
    }

    [Fact]
    public void RotationalSpringToABody_AddsToItsRotation()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("cab", 300, new Point3(0, 0, 1), new InertiaMatrix(40, 50, 60), [new BodyPoint("top", new Point3(0, 0, 2))]));
        b.AddSpring(new Spring("brace", "cab.top", Network.Ground, 0) { Components = [K(Direction.Rx, 2.5e4)] });
        var m = Assembler.Assemble(b.Build());
        var expected = Matrix<double>.Build.Dense(6, 6);
        expected[3, 3] = 2.5e4;
        NumericAssert.Close(expected, m.DenseStiffness(), Tolerance.Abs(0), "K");
    }

    [Fact]
    public void FullInertia_EntersTheMassMatrixAndClearsTheDiagonalFlag()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("cab", 300, new Point3(0, 0, 1), new InertiaMatrix(40, 50, 60, Xy: -3, Yz: 2, Xz: -1), []));
        var m = Assembler.Assemble(b.Build());
        Assert.False(m.MassIsDiagonal);
        var expected = Matrix<double>.Build.DenseOfArray(new double[,]
        {
            { 300, 0, 0, 0, 0, 0 }, { 0, 300, 0, 0, 0, 0 }, { 0, 0, 300, 0, 0, 0 },
            { 0, 0, 0, 40, -3, -1 }, { 0, 0, 0, -3, 50, 2 }, { 0, 0, 0, -1, 2, 60 },
        });
        NumericAssert.Close(expected, m.DenseMass(), Tolerance.Abs(0), "M");
    }

    [Fact]
    public void Influences_SumToTheTotalMassAndTheInertiaAboutTheReferencePoint()
    {
        // ιᵀMι: total mass for a translation; J_o = J_c + Σ m (r² I − r rᵀ) about o for a rotation (parallel axes; common practice).
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 20) { Location = new Point3(1, 2, 0) });
        b.AddBody(new RigidBody("cab", 300, new Point3(0, 0, 1), new InertiaMatrix(40, 50, 60, Xy: -3), []));
        var o = new Point3(0.5, -0.5, 0.25);
        var m = Assembler.Assemble(b.Build(), o);
        var mass = m.DenseMass();
        foreach (var d in new[] { Direction.X, Direction.Y, Direction.Z })
        {
            var iota = m.InfluenceIn(d)!;
            NumericAssert.Close(320, iota * (mass * iota), Tolerance.Rel(1e-14), $"ι_{d.Label()}ᵀMι");
        }
        double Parallel(Point3 r, int i, int j)
        {
            var v = new[] { r.X, r.Y, r.Z };
            return (i == j ? r.Length * r.Length : 0) - v[i] * v[j];
        }
        var j0 = new InertiaMatrix(40, 50, 60, Xy: -3).ToArray();
        var (rm, rc) = (new Point3(1, 2, 0) - o, new Point3(0, 0, 1) - o);
        var rotations = new[] { Direction.Rx, Direction.Ry, Direction.Rz };
        for (var p = 0; p < 3; p++)
            for (var q = 0; q < 3; q++)
            {
                var expected = j0[p, q] + 20 * Parallel(rm, p, q) + 300 * Parallel(rc, p, q);
                NumericAssert.Close(expected, m.InfluenceIn(rotations[p])! * (mass * m.InfluenceIn(rotations[q])!), Tolerance.Rel(1e-13),
                    $"ι_{rotations[p].Label()}ᵀMι_{rotations[q].Label()}");
            }
        Assert.Equal(o, m.ReferencePoint);
        Assert.Same(m.InfluenceIn(Direction.Z), m.Influence);
    }

    [Fact]
    public void ReferencePoint_DefaultsToTheCentreOfMass()
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddMass(new Mass("m", 100) { Location = new Point3(3, 0, 0) });
        b.AddBody(new RigidBody("cab", 300, new Point3(-1, 0, 2), new InertiaMatrix(40, 50, 60), []));
        Assert.Equal(new Point3(0, 0, 1.5), Assembler.Assemble(b.Build()).ReferencePoint);
    }

    [Fact]
    public void LineModel_KeepsOneInfluenceAlongTheLine()
    {
        var m = Assembler.Assemble(new NetworkBuilder().AddMass("a", 2).AddMass("b", 3).Build());
        Assert.Single(m.Influences);
        Assert.Equal(Direction.Along, m.Influences[0].Direction);
        Assert.Null(m.ReferencePoint);
    }

    [Fact]
    public void RotationalComponentAtAPointMassEnd_IsRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 10) { Location = new Point3(0, 0, 0) });
        b.AddSpring(new Spring("twist", "m", Network.Ground, 1) { Components = [K(Direction.Z, 1), K(Direction.Rz, 5)] });
        var e = Assert.Throws<ArgumentException>(() => Assembler.Assemble(b.Build()));
        Assert.Contains("point mass", e.Message);
    }

    [Fact]
    public void ZeroLengthAxialSpring_IsRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddMass(new Mass("m", 10) { Location = new Point3(1, 2, 3) });
        b.AddSupport(new Support("anchor") { Location = new Point3(1, 2, 3) });
        b.AddSpring(new Spring("strut", "m", "anchor", 1e3) { Axial = true });
        var e = Assert.Throws<ArgumentException>(() => Assembler.Assemble(b.Build()));
        Assert.Contains("zero length", e.Message);
    }

    [Theory]
    [InlineData(40, 50, 60, 0, 0, 60)] // J_xx J_zz − J_xz² < 0 … the 3×3 determinant is negative
    [InlineData(-1, 50, 60, 0, 0, 0)]
    [InlineData(40, 50, 60, 45, 0, 0)] // J_xx J_yy − J_xy² < 0
    public void InertiaThatIsNotPositiveDefinite_IsRefused(double xx, double yy, double zz, double xy, double yz, double xz)
    {
        var b = new NetworkBuilder { Space = ModelSpace.ThreeD };
        b.AddBody(new RigidBody("cab", 300, default, new InertiaMatrix(xx, yy, zz, xy, yz, xz), []));
        var e = Assert.Throws<ArgumentException>(() => Assembler.Assemble(b.Build()));
        Assert.Contains("positive definite", e.Message);
    }

    [Fact]
    public void ComponentOutsideThePlane_IsRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddMass(new Mass("m", 10) { Location = new Point3(0, 0, 0) });
        b.AddSpring(new Spring("side", "m", Network.Ground, 1) { Components = [K(Direction.Y, 1)] });
        Assert.Throws<ArgumentException>(() => Assembler.Assemble(b.Build()));
    }

    [Fact]
    public void SpringBetweenTwoPointsOfOneBody_IsRefused()
    {
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddBody(new RigidBody("cab", 300, default, new InertiaMatrix(40, 50, 60), [new BodyPoint("p", new Point3(1, 0, 0)), new BodyPoint("q", new Point3(0, 0, 1))]));
        b.AddSpring(new Spring("inner", "cab.p", "cab.q", 1) { Components = [K(Direction.X, 1)] });
        Assert.Throws<ArgumentException>(() => Assembler.Assemble(b.Build()));
    }

    [Fact]
    public void PlaneBodyPoint_MovesAsTheRigidBodyTransformationSays()
    {
        // A vertical spring at a point r = (r_x, 0, r_z) of a plane body: u_z = z_c − r_x θ_y, so K = k [1, −r_x]ᵀ[1, −r_x];
        // a horizontal one: u_x = x_c + r_z θ_y (θ × r with θ along y).
        var b = new NetworkBuilder { Space = ModelSpace.Plane };
        b.AddBody(new RigidBody("cab", 300, new Point3(1, 0, 1), new InertiaMatrix(40, 50, 60), [new BodyPoint("p", new Point3(3, 0, 4))]));
        b.AddSpring(new Spring("v", "cab.p", Network.Ground, 10) { Components = [K(Direction.Z, 10)] });
        b.AddDamper(new Damper("h", "cab.p", Network.Ground, 7) { Components = [K(Direction.X, 7)] });
        var m = Assembler.Assemble(b.Build());
        var (rx, rz) = (2.0, 3.0);
        var k = Matrix<double>.Build.DenseOfArray(new double[,] { { 0, 0, 0 }, { 0, 10, -10 * rx }, { 0, -10 * rx, 10 * rx * rx } });
        var c = Matrix<double>.Build.DenseOfArray(new double[,] { { 7, 0, 7 * rz }, { 0, 0, 0 }, { 7 * rz, 0, 7 * rz * rz } });
        NumericAssert.Close(k, m.DenseStiffness(), Tolerance.Abs(0), "K");
        NumericAssert.Close(c, m.DenseDamping(), Tolerance.Abs(0), "C");
    }
}
