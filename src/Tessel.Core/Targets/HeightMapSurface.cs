namespace Tessel.Core.Targets;

/// <summary>A target sampled on a regular grid (a height map), interpolated by bicubic cubic
/// convolution with Catmull-Rom weights: it passes through every sample at its pixel centre and has
/// continuous first derivatives (so continuous normals) everywhere, including across pixel borders.</summary>
/// <remarks>Catmull-Rom: Catmull and Rom, "A class of local interpolating splines", 1974; as cubic
/// convolution with a = -1/2: Keys, IEEE Trans. ASSP 29(6), 1981. Samples are row-major with row 0 at
/// +y (image convention); the grid spans <see cref="Width"/> x <see cref="Depth"/> metres centred on the
/// origin with samples at pixel centres. Beyond the outermost pixel centres (the last half pixel) the
/// border samples are repeated, which keeps the surface C1 up to the image edge. Outside the image the
/// height is NaN. Second derivatives jump across pixel borders, so curvatures are piecewise.</remarks>
public sealed class HeightMapSurface : GraphSurface
{
    private readonly double[] _z;
    private readonly double _dx, _dy;

    /// <param name="footprint">Plan region in metres (inside the image).</param>
    /// <param name="columns">Samples per row.</param>
    /// <param name="rows">Number of rows.</param>
    /// <param name="heights">columns*rows heights in metres, row-major, row 0 at +y.</param>
    /// <param name="width">Physical extent along x in metres.</param>
    /// <param name="depth">Physical extent along y in metres.</param>
    public HeightMapSurface(Footprint footprint, int columns, int rows, double[] heights, double width, double depth)
        : base(footprint)
    {
        if (columns < 2 || rows < 2) throw new ArgumentException("a height map needs at least 2 x 2 samples");
        if (heights.Length != columns * rows) throw new ArgumentException("heights must hold columns * rows samples");
        Columns = columns; Rows = rows; Width = width; Depth = depth;
        _z = heights;
        _dx = width / columns; _dy = depth / rows;
    }

    /// <summary>A height map from gray levels (0 = black = <paramref name="minHeight"/>, 1 = white =
    /// <paramref name="maxHeight"/>), all lengths in metres.</summary>
    public static HeightMapSurface FromLevels(Footprint footprint, int columns, int rows, double[] levels,
        double width, double depth, double minHeight, double maxHeight) =>
        new(footprint, columns, rows, levels.Select(l => minHeight + l * (maxHeight - minHeight)).ToArray(), width, depth);

    /// <summary>Samples per row.</summary>
    public int Columns { get; }
    /// <summary>Number of rows.</summary>
    public int Rows { get; }
    /// <summary>Extent along x, metres.</summary>
    public double Width { get; }
    /// <summary>Extent along y, metres.</summary>
    public double Depth { get; }

    public override string Description => $"height map {Columns} x {Rows} samples over {Width:0.###} x {Depth:0.###} m";

    /// <summary>Plan position of the centre of pixel (column, row).</summary>
    public (double X, double Y) PixelCentre(int column, int row) =>
        (-Width / 2 + (column + 0.5) * _dx, Depth / 2 - (row + 0.5) * _dy);

    /// <summary>The stored sample of pixel (column, row), metres.</summary>
    public double Sample(int column, int row) => _z[row * Columns + column];

    public override HeightJet Jet(double x, double y)
    {
        const double slack = 1e-12;
        if (x < -Width / 2 * (1 + slack) || x > Width / 2 * (1 + slack) || y < -Depth / 2 * (1 + slack) || y > Depth / 2 * (1 + slack))
            return new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        // Continuous pixel coordinates: integer values at pixel centres; r grows as y falls.
        double c = (x + Width / 2) / _dx - 0.5;
        double r = (Depth / 2 - y) / _dy - 0.5;
        int c0 = (int)Math.Floor(c), r0 = (int)Math.Floor(r);
        c0 = Math.Clamp(c0, -1, Columns - 1); r0 = Math.Clamp(r0, -1, Rows - 1);
        double tc = c - c0, tr = r - r0;
        Span<double> wc = stackalloc double[4], wc1 = stackalloc double[4], wc2 = stackalloc double[4];
        Span<double> wr = stackalloc double[4], wr1 = stackalloc double[4], wr2 = stackalloc double[4];
        Weights(tc, wc, wc1, wc2);
        Weights(tr, wr, wr1, wr2);
        double v = 0, vc = 0, vr = 0, vcc = 0, vcr = 0, vrr = 0;
        for (int m = 0; m < 4; m++)
        {
            int row = Math.Clamp(r0 - 1 + m, 0, Rows - 1);
            double a = 0, a1 = 0, a2 = 0;
            for (int k = 0; k < 4; k++)
            {
                double s = _z[row * Columns + Math.Clamp(c0 - 1 + k, 0, Columns - 1)];
                a += wc[k] * s; a1 += wc1[k] * s; a2 += wc2[k] * s;
            }
            v += wr[m] * a; vc += wr[m] * a1; vcc += wr[m] * a2;
            vr += wr1[m] * a; vcr += wr1[m] * a1; vrr += wr2[m] * a;
        }
        // dc/dx = 1/dx, dr/dy = -1/dy.
        return new(v, vc / _dx, -vr / _dy, vcc / (_dx * _dx), -vcr / (_dx * _dy), vrr / (_dy * _dy));
    }

    /// <summary>Catmull-Rom weights of the four samples p(-1), p0, p1, p2 at t in [0, 1], and their first and
    /// second derivatives in t: p(t) = 1/2 [2 p0 + (p1 - p(-1)) t + (2p(-1) - 5p0 + 4p1 - p2) t^2 + (-p(-1) + 3p0 - 3p1 + p2) t^3].</summary>
    private static void Weights(double t, Span<double> w, Span<double> w1, Span<double> w2)
    {
        double t2 = t * t, t3 = t2 * t;
        w[0] = 0.5 * (-t + 2 * t2 - t3);
        w[1] = 0.5 * (2 - 5 * t2 + 3 * t3);
        w[2] = 0.5 * (t + 4 * t2 - 3 * t3);
        w[3] = 0.5 * (-t2 + t3);
        w1[0] = 0.5 * (-1 + 4 * t - 3 * t2);
        w1[1] = 0.5 * (-10 * t + 9 * t2);
        w1[2] = 0.5 * (1 + 8 * t - 9 * t2);
        w1[3] = 0.5 * (-2 * t + 3 * t2);
        w2[0] = 0.5 * (4 - 6 * t);
        w2[1] = 0.5 * (-10 + 18 * t);
        w2[2] = 0.5 * (8 - 18 * t);
        w2[3] = 0.5 * (-2 + 6 * t);
    }
}
