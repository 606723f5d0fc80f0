using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace Tessel.Core.Fitting.Sparse;

/// <summary>Inner kernels shared by the direct factorisations.</summary>
internal static class DenseKernels
{
    /// <summary>Dot product of two contiguous runs a[aStart..+length) and b[bStart..+length) with eight
    /// fixed partial sums (lane k takes elements k, k+8, ...) combined in a fixed order, so the SIMD
    /// and the scalar path give the same bits (determinism across machines).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double Dot(double[] a, long aStart, double[] b, long bStart, int length)
    {
        if (length <= 0) return 0;
        int i = 0;
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        if (length >= 8)
        {
            if (Vector256.IsHardwareAccelerated)
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
}
