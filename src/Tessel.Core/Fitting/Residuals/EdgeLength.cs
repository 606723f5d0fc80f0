using Tessel.Core.Geometry;

namespace Tessel.Core.Fitting.Residuals;

/// <summary>Length of the edge a-b in metres with its gradient.</summary>
public static class EdgeLength
{
    /// <summary>|b - a|; <paramref name="grad"/> (6 numbers) receives d/da, d/db.</summary>
    public static double Evaluate(ReadOnlySpan<double> xyz, int a, int b, Span<double> grad)
    {
        var d = Vec3.Read(xyz, b) - Vec3.Read(xyz, a);
        double len = d.Length;
        var u = len > 0 ? d / len : Vec3.Zero;
        (-u).Write(grad, 0);
        u.Write(grad, 1);
        return len;
    }

    /// <summary>|b - a| alone (the same number <see cref="Evaluate"/> returns).</summary>
    public static double Value(ReadOnlySpan<double> xyz, int a, int b) => (Vec3.Read(xyz, b) - Vec3.Read(xyz, a)).Length;
}
