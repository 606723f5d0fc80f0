namespace Tessel.Core.Fitting.Residuals;

/// <summary>The two vertex residuals of a folded crease pattern, from sector angles measured on the
/// folded mesh: developability sum(t) - 2 pi, and Kawasaki's alternating sum t1 - t2 + t3 - ...
/// (Kawasaki 1989; Justin 1986). Both in radians.</summary>
public static class SectorAngleSums
{
    /// <summary>sum_k t_k - 2 pi. <paramref name="grad"/> (3 * (1 + degree) numbers) receives
    /// d/dcenter then d/dRing[k] in ring order.</summary>
    public static double Developability(ReadOnlySpan<double> xyz, VertexStar star, Span<double> grad) =>
        Sum(xyz, star, alternating: false, grad) - 2 * Math.PI;

    /// <summary>sum_k (-1)^k t_k for an even degree (0 at a flat-foldable vertex); gradient as in
    /// <see cref="Developability"/>. Odd-degree vertices cannot fold flat and are rejected.</summary>
    public static double Kawasaki(ReadOnlySpan<double> xyz, VertexStar star, Span<double> grad)
    {
        if (star.Degree % 2 != 0) throw new ArgumentException($"vertex {star.Center} has odd degree {star.Degree}: Kawasaki's condition needs an even degree");
        return Sum(xyz, star, alternating: true, grad);
    }

    private static double Sum(ReadOnlySpan<double> xyz, VertexStar star, bool alternating, Span<double> grad)
    {
        int deg = star.Degree;
        grad[..(3 * (deg + 1))].Clear();
        Span<double> g = stackalloc double[9];
        double total = 0;
        for (int k = 0; k < deg; k++)
        {
            int k1 = (k + 1) % deg;
            double sign = alternating && k % 2 == 1 ? -1 : 1;
            total += sign * CornerAngle.Evaluate(xyz, star.Center, star.Ring[k], star.Ring[k1], g);
            for (int c = 0; c < 3; c++)
            {
                grad[c] += sign * g[c];
                grad[3 * (1 + k) + c] += sign * g[3 + c];
                grad[3 * (1 + k1) + c] += sign * g[6 + c];
            }
        }
        return total;
    }
}
