using System.Diagnostics;
using MathNet.Numerics.LinearAlgebra.Double;
using Tessel.Core.LinearAlgebra;
using Tessel.Core.Model;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Checks;

/// <summary>Counts the folding degrees of freedom of a folded crease pattern by the bar-and-hinge rank count
/// DOF = 3N - rank(J) - 6 (Pellegrino &amp; Calladine, IJSS 1986; Schenk &amp; Guest, Origami 5, 2011).</summary>
/// <remarks>Evaluate at a folded state: the flat state is a branch point where J loses rank and every
/// pattern looks mobile. Constraint counting alone predicts 0 for a Miura sheet; the rank shows the one
/// rigid-folding motion that Tachi (J. IASS 50(3), 2009) proves exists.</remarks>
public static class RigidityAnalysis
{
    /// <summary>Shift of the shift-invert iteration as a share of the largest eigenvalue of J^T J: null vectors
    /// converge at shift / (lambda + shift) per sweep, and the shift must still dominate the factorisation's
    /// rounding (about 1e-16 x envelope width x lambdaMax).</summary>
    private const double ShiftShare = 1e-11;

    /// <summary>Larger shift tried when the first factor fails (indefinite in rounding).</summary>
    private const double RetryShiftShare = 1e-8;

    /// <summary>Block size the subspace iteration starts with (grown while the null space fills it).</summary>
    private const int InitialRitzBlock = 16;

    public static RigidityResult DegreesOfFreedom(CreaseMesh mesh, RigiditySettings? settings = null)
    {
        settings ??= new RigiditySettings();
        var clock = Stopwatch.StartNew();
        var model = BarHingeModel.FromMesh(mesh);
        var j = model.Jacobian(mesh.Positions);
        bool dense = settings.Method == RankMethod.DenseSvd ||
                     (settings.Method == RankMethod.Auto && j.Columns <= settings.DenseColumnLimit);
        var (singular, method) = dense ? DenseSingularValues(j) : SmallestSingularValues(j, settings.RankTolerance);
        // singular: descending; for the shift-invert path only the smallest few plus the largest are known,
        // and the count of values below the threshold is what matters.
        double largest = singular.Largest;
        double threshold = settings.RankTolerance * largest;
        int nullity = singular.ImplicitZeros + singular.Values.Count(s => s <= threshold);
        int rank = j.Columns - nullity;
        double kept = singular.Values.Where(s => s > threshold).DefaultIfEmpty(largest).Min();
        double dropped = singular.Values.Where(s => s <= threshold).DefaultIfEmpty(0).Max();
        double gap = dropped > 0 ? kept / dropped : double.PositiveInfinity;
        return new RigidityResult(j.Columns - rank - 6, j.Columns, j.Rows, rank, settings.RankTolerance, largest,
            kept / largest, dropped / largest, gap, method, clock.Elapsed);
    }

    /// <summary>Singular values known to a method: <paramref name="Values"/> (some or all),
    /// <paramref name="ImplicitZeros"/> more that are exactly zero (columns beyond the row count).</summary>
    private sealed record SingularValues(double Largest, double[] Values, int ImplicitZeros);

    private static (SingularValues, string) DenseSingularValues(CsrMatrix j)
    {
        var a = DenseMatrix.Create(j.Rows, j.Columns, 0);
        for (int r = 0; r < j.Rows; r++)
            for (int k = j.RowStart[r]; k < j.RowStart[r + 1]; k++) a[r, j.ColumnIndices[k]] = j.Values[k];
        var s = a.Svd(computeVectors: false).S.ToArray();
        Array.Sort(s); Array.Reverse(s);
        return (new SingularValues(s.Length > 0 ? s[0] : 0, s, Math.Max(0, j.Columns - s.Length)), "dense-svd");
    }

    private static (SingularValues, string) SmallestSingularValues(CsrMatrix j, double tolerance)
    {
        double lambdaMax = ShiftInvertSubspace.LargestEigenvalue(j);
        double shift = ShiftShare * lambdaMax;
        var factor = EnvelopeCholesky.Factor(j, shift, null)
                     ?? EnvelopeCholesky.Factor(j, RetryShiftShare * lambdaMax, null)
                     ?? throw new InvalidOperationException("normal matrix could not be factored");
        double threshold = tolerance * tolerance * lambdaMax;
        var ritz = ShiftInvertSubspace.SmallestWithGrowth(j, factor, null, threshold, InitialRitzBlock);
        var values = ritz.Values.Select(v => Math.Sqrt(Math.Max(v, 0))).ToArray();
        return (new SingularValues(Math.Sqrt(lambdaMax), values, 0), "shift-invert-subspace");
    }
}
