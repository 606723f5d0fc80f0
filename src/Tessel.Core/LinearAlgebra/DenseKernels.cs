using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Tessel.Core.LinearAlgebra;

/// <summary>Inner kernels shared by the direct factorisations.</summary>
/// <remarks><c>allowSimd = false</c> forces the scalar path (tests check both give the same bits).</remarks>
internal static class DenseKernels
{
    /// <summary>Dot product of two contiguous runs a[aStart..+length) and b[bStart..+length) with eight
    /// fixed partial sums (lane k takes elements k, k+8, ...) combined in a fixed order, so the SIMD
    /// and the scalar path give the same bits (determinism across machines).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double Dot(double[] a, long aStart, double[] b, long bStart, int length, bool allowSimd = true)
    {
        if (length <= 0) return 0;
        int i = 0;
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        if (length >= 8)
        {
            if (allowSimd && Vector256.IsHardwareAccelerated)
            {
                ref double ra = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(a), (nint)aStart);
                ref double rb = ref Unsafe.Add(ref MemoryMarshal.GetArrayDataReference(b), (nint)bStart);
                var lo = Vector256<double>.Zero;
                var hi = Vector256<double>.Zero;
                for (; i <= length - 8; i += 8)
                {
                    lo += Vector256.LoadUnsafe(ref ra, (nuint)i) * Vector256.LoadUnsafe(ref rb, (nuint)i);
                    hi += Vector256.LoadUnsafe(ref ra, (nuint)(i + 4)) * Vector256.LoadUnsafe(ref rb, (nuint)(i + 4));
                }
                var sum = lo + hi;
                s0 = sum.GetElement(0); s1 = sum.GetElement(1); s2 = sum.GetElement(2); s3 = sum.GetElement(3);
            }
            else
            {
                double t0 = 0, t1 = 0, t2 = 0, t3 = 0, t4 = 0, t5 = 0, t6 = 0, t7 = 0;
                for (; i <= length - 8; i += 8)
                {
                    long pa = aStart + i, pb = bStart + i;
                    t0 += a[pa] * b[pb]; t1 += a[pa + 1] * b[pb + 1]; t2 += a[pa + 2] * b[pb + 2]; t3 += a[pa + 3] * b[pb + 3];
                    t4 += a[pa + 4] * b[pb + 4]; t5 += a[pa + 5] * b[pb + 5]; t6 += a[pa + 6] * b[pb + 6]; t7 += a[pa + 7] * b[pb + 7];
                }
                s0 = t0 + t4; s1 = t1 + t5; s2 = t2 + t6; s3 = t3 + t7;
            }
        }
        double s = (s0 + s1) + (s2 + s3);
        for (; i < length; i++) s += a[aStart + i] * b[bStart + i];
        return s;
    }

    /// <summary>The four dot products of rows a0, a1 with rows b0, b1 (all in <paramref name="m"/>, each a
    /// contiguous run of <paramref name="length"/>), sharing the loads: the register-blocked core of the
    /// Schur complement update. Four fixed lanes per product (lane k takes elements k, k+4, ...),
    /// combined in a fixed order, so the SIMD and the scalar path give the same bits.</summary>
    internal static void Dot2x2(double[] m, long a0, long a1, long b0, long b1, int length,
        out double s00, out double s01, out double s10, out double s11, bool allowSimd = true)
    {
        int i = 0;
        if (allowSimd && length >= 4 && Vector256.IsHardwareAccelerated)
        {
            ref double r = ref MemoryMarshal.GetArrayDataReference(m);
            ref double ra0 = ref Unsafe.Add(ref r, (nint)a0);
            ref double ra1 = ref Unsafe.Add(ref r, (nint)a1);
            ref double rb0 = ref Unsafe.Add(ref r, (nint)b0);
            ref double rb1 = ref Unsafe.Add(ref r, (nint)b1);
            var v00 = Vector256<double>.Zero;
            var v01 = Vector256<double>.Zero;
            var v10 = Vector256<double>.Zero;
            var v11 = Vector256<double>.Zero;
            for (; i <= length - 4; i += 4)
            {
                var x0 = Vector256.LoadUnsafe(ref ra0, (nuint)i);
                var x1 = Vector256.LoadUnsafe(ref ra1, (nuint)i);
                var y0 = Vector256.LoadUnsafe(ref rb0, (nuint)i);
                var y1 = Vector256.LoadUnsafe(ref rb1, (nuint)i);
                v00 += x0 * y0;
                v01 += x0 * y1;
                v10 += x1 * y0;
                v11 += x1 * y1;
            }
            s00 = Lanes(v00); s01 = Lanes(v01); s10 = Lanes(v10); s11 = Lanes(v11);
        }
        else
        {
            Span<double> acc = stackalloc double[16];
            for (; i <= length - 4; i += 4)
                for (int lane = 0; lane < 4; lane++)
                {
                    double x0 = m[a0 + i + lane], x1 = m[a1 + i + lane], y0 = m[b0 + i + lane], y1 = m[b1 + i + lane];
                    acc[lane] += x0 * y0;
                    acc[4 + lane] += x0 * y1;
                    acc[8 + lane] += x1 * y0;
                    acc[12 + lane] += x1 * y1;
                }
            s00 = (acc[0] + acc[1]) + (acc[2] + acc[3]);
            s01 = (acc[4] + acc[5]) + (acc[6] + acc[7]);
            s10 = (acc[8] + acc[9]) + (acc[10] + acc[11]);
            s11 = (acc[12] + acc[13]) + (acc[14] + acc[15]);
        }
        for (; i < length; i++)
        {
            double x0 = m[a0 + i], x1 = m[a1 + i], y0 = m[b0 + i], y1 = m[b1 + i];
            s00 += x0 * y0;
            s01 += x0 * y1;
            s10 += x1 * y0;
            s11 += x1 * y1;
        }
    }

    /// <summary>The two dot products of rows a0, a1 with row b (contiguous runs in <paramref name="m"/>),
    /// sharing the loads of b; lanes as in <see cref="Dot2x2"/>.</summary>
    internal static void Dot2x1(double[] m, long a0, long a1, long b, int length, out double s0, out double s1, bool allowSimd = true)
    {
        int i = 0;
        if (allowSimd && length >= 4 && Vector256.IsHardwareAccelerated)
        {
            ref double r = ref MemoryMarshal.GetArrayDataReference(m);
            ref double ra0 = ref Unsafe.Add(ref r, (nint)a0);
            ref double ra1 = ref Unsafe.Add(ref r, (nint)a1);
            ref double rb = ref Unsafe.Add(ref r, (nint)b);
            var v0 = Vector256<double>.Zero;
            var v1 = Vector256<double>.Zero;
            for (; i <= length - 4; i += 4)
            {
                var y = Vector256.LoadUnsafe(ref rb, (nuint)i);
                v0 += Vector256.LoadUnsafe(ref ra0, (nuint)i) * y;
                v1 += Vector256.LoadUnsafe(ref ra1, (nuint)i) * y;
            }
            s0 = Lanes(v0); s1 = Lanes(v1);
        }
        else
        {
            Span<double> acc = stackalloc double[8];
            for (; i <= length - 4; i += 4)
                for (int lane = 0; lane < 4; lane++)
                {
                    double y = m[b + i + lane];
                    acc[lane] += m[a0 + i + lane] * y;
                    acc[4 + lane] += m[a1 + i + lane] * y;
                }
            s0 = (acc[0] + acc[1]) + (acc[2] + acc[3]);
            s1 = (acc[4] + acc[5]) + (acc[6] + acc[7]);
        }
        for (; i < length; i++)
        {
            double y = m[b + i];
            s0 += m[a0 + i] * y;
            s1 += m[a1 + i] * y;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Lanes(Vector256<double> v) => (v.GetElement(0) + v.GetElement(1)) + (v.GetElement(2) + v.GetElement(3));
}
