using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

namespace ModalChain.Core.Solvers;

/// <summary>Complex dot products and updates on spans, vectorised with AVX where the processor has it.</summary>
/// <remarks>
/// A complex number is two adjacent doubles (re, im). With a = (ar, ai) and b = (br, bi): the elementwise products
/// a⊙b = (ar·br, ai·bi) and a⊙swap(b) = (ar·bi, ai·br) summed over the span give Σab = (Σ(ar·br − ai·bi), Σ(ar·bi + ai·br)).
/// Results equal the scalar loops up to the order of floating-point additions.
/// </remarks>
internal static class ComplexKernels
{
    /// <summary>Σ_j a[j]·b[j] (no conjugation).</summary>
    public static Complex Dot(ReadOnlySpan<Complex> a, ReadOnlySpan<Complex> b)
    {
        var n = a.Length;
        var j = 0;
        var sum = Complex.Zero;
        if (Avx.IsSupported && n >= 4)
        {
            var da = MemoryMarshal.Cast<Complex, double>(a);
            var db = MemoryMarshal.Cast<Complex, double>(b);
            var p = Vector256<double>.Zero;
            var q = Vector256<double>.Zero;
            ref var ra = ref MemoryMarshal.GetReference(da);
            ref var rb = ref MemoryMarshal.GetReference(db);
            for (; j + 2 <= n; j += 2)
            {
                var va = Vector256.LoadUnsafe(ref ra, (nuint)(2 * j));
                var vb = Vector256.LoadUnsafe(ref rb, (nuint)(2 * j));
                p = Avx.Add(p, Avx.Multiply(va, vb));
                q = Avx.Add(q, Avx.Multiply(va, Avx.Permute(vb, 0b0101)));
            }
            sum = new Complex(p.GetElement(0) - p.GetElement(1) + p.GetElement(2) - p.GetElement(3),
                q.GetElement(0) + q.GetElement(1) + q.GetElement(2) + q.GetElement(3));
        }
        for (; j < n; j++) sum += a[j] * b[j];
        return sum;
    }

    /// <summary>y[j] −= l·x[j].</summary>
    public static void SubtractScaled(Span<Complex> y, Complex l, ReadOnlySpan<Complex> x)
    {
        var n = y.Length;
        var j = 0;
        if (Avx.IsSupported && n >= 4)
        {
            var dy = MemoryMarshal.Cast<Complex, double>(y);
            var dx = MemoryMarshal.Cast<Complex, double>(x);
            var lr = Vector256.Create(l.Real);
            var li = Vector256.Create(-l.Imaginary, l.Imaginary, -l.Imaginary, l.Imaginary);
            ref var ry = ref MemoryMarshal.GetReference(dy);
            ref var rx = ref MemoryMarshal.GetReference(dx);
            for (; j + 2 <= n; j += 2)
            {
                var vx = Vector256.LoadUnsafe(ref rx, (nuint)(2 * j));
                var vy = Vector256.LoadUnsafe(ref ry, (nuint)(2 * j));
                var product = Avx.Add(Avx.Multiply(vx, lr), Avx.Multiply(Avx.Permute(vx, 0b0101), li));
                Avx.Subtract(vy, product).StoreUnsafe(ref ry, (nuint)(2 * j));
            }
        }
        for (; j < n; j++) y[j] -= l * x[j];
    }

    /// <summary>y[j] = −h[j] − l·u[j] (the fresh row of sI − H minus a multiple of the pivot row).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static void NegateSubtractScaled(Span<Complex> y, ReadOnlySpan<Complex> h, Complex l, ReadOnlySpan<Complex> u)
    {
        for (var j = 0; j < y.Length; j++) y[j] = -h[j];
        SubtractScaled(y, l, u);
    }
}
