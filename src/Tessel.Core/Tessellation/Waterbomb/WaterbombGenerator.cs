using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation.Miura;

namespace Tessel.Core.Tessellation.Waterbomb;

/// <summary>The waterbomb tessellation (J. Comput. Des. Eng. 5(4), 2018, via docs/reference/geometry.md section 3):
/// waterbomb bases (a degree-6 vertex: four diagonals and the two halves of a midline) side by side in
/// rows along x, every other row shifted by half a base, all facets triangles.</summary>
/// <remarks>
/// Flat layout (<see cref="FlatLayout"/>), base width w, row height h: grid-line vertices R(k, j) at
/// (k w/2, j h), k = 0..2n, j = 0..rows, index j (2n+1) + k; base centres C(k, j) at (k w/2, (j+1/2) h)
/// wherever k + j is odd, numbered after the grid vertices row by row. In row j the vertical line k is
/// the midline of a base when k + j is odd and the side shared by two bases when it is even, so the
/// shift by half a base from row to row comes out of the parity alone; odd rows end in half bases whose
/// centre lies on the sheet's edge. Every interior vertex has degree 6: a centre has sectors 2t, 90-t,
/// 90-t, 2t, 90-t, 90-t (degrees, tan t = h/w), a grid vertex 90, 90, t, 90-t, 90-t, t, so the sums are
/// 360 and the alternating sums 0 exactly: developable and Kawasaki (Kawasaki 1989) by construction.
/// Folded, the diagonals are mountains and every grid line (row lines, midlines, sides) a valley
/// (Maekawa: 4 - 2 at a centre, 2 - 4 at a grid vertex). Folded uniformly the sheet curls into a tube
/// around x; the fit grades the cells where the target is doubly curved.
/// Starting drape: centres on the target (top layer), grid vertices on the offset surface FoldDepth
/// below (bottom layer), and each midline end pulled toward its own centre by Tuck x h in plan. With
/// the centres raised each base is a tent: diagonals become ridges and the row lines and sides valleys;
/// the tuck dents the two facets beside each midline into a valley too, so every crease starts with
/// its waterbomb sign and none starts flat (a smooth start has no developability gradient, see
/// DEVELOPERS.md). On a plane one tuck (<see cref="DevelopableTuck"/>) makes every interior vertex
/// developable. On a curved target that one tuck leaves large defects, so the drape is graded: each base gets
/// the tuck that closes its own centre's angle sum on the target, and each grid vertex the mean of its bases'
/// tucks; the fit removes the rest (measurements in docs/decisions.md).
/// </remarks>
public static class WaterbombGenerator
{
    /// <summary>Builds and drapes the tessellation; throws <see cref="ArgumentException"/> naming the parameter.</summary>
    public static GeneratedPattern Generate(ITargetSurface target, WaterbombParameters p)
    {
        if (!(p.FoldDepth > 0) || !double.IsFinite(p.FoldDepth))
            throw new ArgumentException($"FoldDepth = {p.FoldDepth} m must be a positive height of the base centres above the grid lines; use e.g. a fifth of the cell size", nameof(p.FoldDepth));
        if (p.Tuck is double given && !(given > 0 && given < 0.5))
            throw new ArgumentException($"Tuck = {given} is outside (0, 0.5): without a tuck the midlines start flat; use e.g. 0.18 of the row height, or leave it out", nameof(p.Tuck));
        var fp = target.Footprint;
        int bases = CellCounts.Resolve(p.Bases, p.CellSize, fp.Width, nameof(p.Bases));
        int rows = CellCounts.Resolve(p.Rows, p.CellSize, fp.Depth, nameof(p.Rows));
        double w = fp.Width / bases, h = fp.Depth / rows;
        if (!(p.FoldDepth < Math.Min(w, h)))
            throw new ArgumentException($"FoldDepth = {p.FoldDepth} m is not below the base size ({Math.Min(w, h):0.####} m); the bases would start folded shut, use a depth of about a fifth of it", nameof(p.FoldDepth));

        var (plan, faces) = FlatLayout(bases, rows, w, h);
        int nx = 2 * bases + 1, gridCount = nx * (rows + 1), n = plan.Length / 2;
        double planeTuck = DevelopableTuck(w, h, p.FoldDepth);

        // A vertex of the drape with its midline end tucked by `tuck` (fraction of h): centres on the
        // target, grid vertices FoldDepth below it along the normal. The outer row lines are tucked as
        // if the tessellation went on, so every interior vertex starts developable on a plane; they
        // overhang the footprint by the tuck.
        // On a polygon footprint the sheet over the bounding box is cut to the cells inside it
        // (FootprintTrim), judged by the untucked layout so that the tuck never changes what is kept.
        bool trim = !fp.IsRectangle;
        var keep = new bool[n];
        for (int v = 0; v < n; v++)
        {
            var at = new Vec2(fp.MinX + plan[2 * v], fp.MinY + plan[2 * v + 1]);
            // A grid vertex also needs a surface under its tucked place (the tuck stays below half a row).
            var tucked = v < gridCount ? at + new Vec2(0, ((v % nx + v / nx) % 2 == 1 ? 0.5 : -0.5) * h) : at;
            keep[v] = !trim || (FootprintTrim.Keeps(target, at) && FootprintTrim.Keeps(target, tucked));
        }
        Vec3 Place(int v, double tuck)
        {
            if (!keep[v]) return new Vec3(double.NaN, double.NaN, double.NaN);
            double x = fp.MinX + plan[2 * v], y = fp.MinY + plan[2 * v + 1];
            bool centre = v >= gridCount;
            // Midline end of the row above (k + j odd) or of the row below (even).
            if (!centre) y += ((v % nx + v / nx) % 2 == 1 ? 1 : -1) * tuck * h;
            var sample = double.IsFinite(target.HeightAt(x, y))
                ? new Vec2(x, y)
                : new Vec2(Math.Clamp(x, fp.MinX, fp.MaxX), Math.Clamp(y, fp.MinY, fp.MaxY));
            double z = target.HeightAt(sample.X, sample.Y);
            if (!double.IsFinite(z))
                throw new ArgumentException($"the sheet reaches ({x:0.###}, {y:0.###}) m where the target has no surface; use a smaller footprint or a target that covers it", nameof(target));
            var onTarget = new Vec3(x, y, z);
            return centre ? onTarget : onTarget - p.FoldDepth * target.NormalAt(sample.X, sample.Y);
        }

        var ring = CentreRings(faces, n, gridCount);
        var tucks = new double[n];
        if (p.Tuck is double uniform) Array.Fill(tucks, uniform);
        else
        {
            // Graded: each centre gets the tuck that closes its own angle sum on the target (its ring
            // tucked alike); a grid vertex takes the mean of the centres around it.
            var sum = new double[n];
            var count = new int[n];
            for (int c = gridCount; c < n; c++)
                if (ring[c].Length == 6) tucks[c] = GradedTuck(c, ring[c], Place, planeTuck);
            // A half base on the sheet's edge has no angle sum to close: it copies the next centre in its
            // row (numbered consecutively along the row).
            for (int c = gridCount; c < n; c++)
                if (ring[c].Length != 6) tucks[c] = tucks[plan[2 * c] < 0.5 * w ? c + 1 : c - 1];
            for (int c = gridCount; c < n; c++)
                foreach (int v in ring[c]) { sum[v] += tucks[c]; count[v]++; }
            for (int v = 0; v < gridCount; v++) tucks[v] = count[v] > 0 ? sum[v] / count[v] : planeTuck;
        }
        var pos = new double[3 * n];
        var layers = new VertexLayer[n];
        for (int v = 0; v < n; v++)
        {
            // A vertex the cut drops only needs a finite place until it is removed.
            (keep[v] ? Place(v, tucks[v]) : new Vec3(fp.MinX + plan[2 * v], fp.MinY + plan[2 * v + 1], 0)).Write(pos, v);
            layers[v] = v >= gridCount ? VertexLayer.Top : VertexLayer.Bottom;
        }
        const FamilyConstraints constraints = FamilyConstraints.Developability | FamilyConstraints.Kawasaki | FamilyConstraints.FoldSigns;
        int anchor = CentreIndex(bases, rows, bases, rows / 2);
        // Roles read from the drape: a crease the cut keeps inside has both its faces, all draped.
        var mesh = RegularMiuraSheet.AssignRolesFromGeometry(
            new CreaseMesh("waterbomb", pos, faces, layers, (_, _) => CreaseRole.Flat));
        if (!trim) return new GeneratedPattern(mesh, constraints, FairnessStencils(bases, rows), anchor, p.FoldDepth);
        var cut = FootprintTrim.Trim(mesh, keep, FairnessStencils(bases, rows), anchor);
        return new GeneratedPattern(cut.Mesh, constraints, cut.FairnessStencils, cut.AnchorVertex, p.FoldDepth);
    }

    /// <summary>The tuck (fraction of the row height) at which the regular drape on a plane is developable:
    /// centres FoldDepth above the grid vertices, midline ends pulled in by tuck x h. By symmetry the
    /// alternating sums vanish at every vertex and, the drape being periodic, the centres' angle defect
    /// is minus twice the grid vertices' (their total per period is zero), so one equation, the centre's
    /// angle sum = 2 pi, fixes it. The sum grows with the tuck; found by bisection on [0, 0.5).
    /// Measured for square bases: 0.168 at depth 0.05 w, 0.186 at 0.2 w, 0.274 at 0.5 w.</summary>
    public static double DevelopableTuck(double baseWidth, double rowHeight, double foldDepth)
    {
        double lo = 0, hi = 0.4999;
        if (CentreAngleSum(baseWidth, rowHeight, foldDepth, hi) < 2 * Math.PI)
            throw new ArgumentException($"FoldDepth = {foldDepth} m is too deep for bases of {baseWidth:0.####} m x {rowHeight:0.####} m: no tuck makes the start developable; use a depth of about a fifth of the base", nameof(WaterbombParameters.FoldDepth));
        for (int i = 0; i < 60; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (CentreAngleSum(baseWidth, rowHeight, foldDepth, mid) < 2 * Math.PI) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>Sum of the six sector angles at a centre of the regular planar drape: its ring (corner,
    /// midline end, corner, corner, midline end, corner counter-clockwise), corners pulled away from the
    /// centre's row by the tuck and midline ends toward it, all FoldDepth below the centre.</summary>
    private static double CentreAngleSum(double w, double h, double d, double tuck)
    {
        double t = tuck * h;
        Vec3[] ring =
        [
            new(w / 2, -h / 2 - t, -d), new(w / 2, h / 2 + t, -d), new(0, h / 2 - t, -d),
            new(-w / 2, h / 2 + t, -d), new(-w / 2, -h / 2 - t, -d), new(0, -h / 2 + t, -d),
        ];
        double sum = 0;
        for (int i = 0; i < 6; i++)
        {
            Vec3 a = ring[i], b = ring[(i + 1) % 6];
            sum += Math.Atan2(Vec3.Cross(a, b).Length, Vec3.Dot(a, b));
        }
        return sum;
    }

    /// <summary>Bisection on the tuck of one centre's closed star so that its angle sum is 2 pi on the
    /// target; the plane's tuck where the target leaves no root in [0, 0.5).</summary>
    private static double GradedTuck(int centre, int[] ring, Func<int, double, Vec3> place, double planeTuck)
    {
        double AngleSum(double t)
        {
            var c = place(centre, t);
            double total = 0;
            for (int i = 0; i < ring.Length; i++)
            {
                Vec3 a = place(ring[i], t) - c, b = place(ring[(i + 1) % ring.Length], t) - c;
                total += Math.Atan2(Vec3.Cross(a, b).Length, Vec3.Dot(a, b));
            }
            return total;
        }
        double lo = 0, hi = 0.4999;
        // A base the footprint cuts has a ring vertex without a place: it keeps the plane's tuck.
        if (!double.IsFinite(AngleSum(lo)) || AngleSum(lo) > 2 * Math.PI || AngleSum(hi) < 2 * Math.PI) return planeTuck;
        for (int i = 0; i < 50; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (AngleSum(mid) < 2 * Math.PI) lo = mid; else hi = mid;
        }
        return 0.5 * (lo + hi);
    }

    /// <summary>The grid vertices around each centre in angular order (any start; the angle sum does
    /// not depend on it), from the centre's triangles; empty for grid vertices.</summary>
    private static int[][] CentreRings(int[][] faces, int n, int gridCount)
    {
        var next = new Dictionary<int, int>[n];
        foreach (var f in faces)
            for (int k = 0; k < 3; k++)
                if (f[k] >= gridCount) (next[f[k]] ??= [])[f[(k + 1) % 3]] = f[(k + 2) % 3];
        var rings = new int[n][];
        for (int v = 0; v < n; v++)
        {
            if (next[v] is not { } map) { rings[v] = []; continue; }
            // A boundary centre's fan is open: start where no triangle leads in.
            int start = map.Keys.FirstOrDefault(a => !map.ContainsValue(a), map.Keys.Min());
            var ring = new List<int> { start };
            while (map.TryGetValue(ring[^1], out int b) && b != start) ring.Add(b);
            rings[v] = ring.ToArray();
        }
        return rings;
    }

    /// <summary>The flat crease pattern: 2D positions (x0 y0 x1 ...) from the sheet's corner and the
    /// triangles, counter-clockwise; vertex numbering as in the remarks.</summary>
    public static (double[] Positions, int[][] Faces) FlatLayout(int bases, int rows, double baseWidth, double rowHeight)
    {
        if (bases < 1 || rows < 1) throw new ArgumentOutOfRangeException(nameof(bases), "at least one base and one row");
        int nx = 2 * bases + 1;
        var xy = new List<double>();
        for (int j = 0; j <= rows; j++)
            for (int k = 0; k < nx; k++) { xy.Add(k * baseWidth / 2); xy.Add(j * rowHeight); }
        for (int j = 0; j < rows; j++)
            for (int k = 0; k < nx; k++)
                if ((k + j) % 2 == 1) { xy.Add(k * baseWidth / 2); xy.Add((j + 0.5) * rowHeight); }
        var positions = xy.ToArray();
        int R(int k, int j) => j * nx + k;
        var faces = new List<int[]>();
        for (int j = 0; j < rows; j++)
            for (int k = 0; k + 1 < nx; k++)
            {
                // Strip between lines k and k+1 of row j: the centre sits on whichever is the midline.
                int m = (k + j) % 2 == 1 ? k : k + 1, s = m == k ? k + 1 : k;
                int c = CentreIndex(bases, rows, m, j);
                Add(faces, positions, c, R(m, j), R(s, j));
                Add(faces, positions, c, R(s, j), R(s, j + 1));
                Add(faces, positions, c, R(s, j + 1), R(m, j + 1));
            }
        return (positions, faces.ToArray());
    }

    /// <summary>Index of the centre on line k of row j (k + j odd), or of the centre nearest to it.</summary>
    private static int CentreIndex(int bases, int rows, int k, int j)
    {
        int nx = 2 * bases + 1;
        if ((k + j) % 2 == 0) k = k > 0 ? k - 1 : k + 1;
        // Row j holds the centres on lines of parity opposite to j: bases + (j odd ? 1 : 0) of them.
        int before = 0;
        for (int r = 0; r < j; r++) before += r % 2 == 1 ? bases + 1 : bases;
        return nx * (rows + 1) + before + k / 2;
    }

    private static void Add(List<int[]> faces, double[] xy, int a, int b, int c)
    {
        double area = (xy[2 * b] - xy[2 * a]) * (xy[2 * c + 1] - xy[2 * a + 1]) - (xy[2 * c] - xy[2 * a]) * (xy[2 * b + 1] - xy[2 * a + 1]);
        faces.Add(area > 0 ? [a, b, c] : [a, c, b]);
    }

    /// <summary>Same-kind second differences that vanish on the regular drape: grid vertices two lines
    /// apart along a row line and two row lines apart across (the tuck repeats with period 2 both
    /// ways), centres two lines apart in a row and two rows apart.</summary>
    private static int[] FairnessStencils(int bases, int rows)
    {
        int nx = 2 * bases + 1;
        var s = new List<int>();
        for (int j = 0; j <= rows; j++)
            for (int k = 0; k < nx; k++)
            {
                int c = j * nx + k;
                if (k >= 2 && k + 2 < nx) s.AddRange([c - 2, c, c + 2]);
                if (j >= 2 && j + 2 <= rows) s.AddRange([c - 2 * nx, c, c + 2 * nx]);
            }
        for (int j = 0; j < rows; j++)
            for (int k = 0; k < nx; k++)
            {
                if ((k + j) % 2 == 0) continue;
                int c = CentreIndex(bases, rows, k, j);
                if (k >= 2 && k + 2 < nx) s.AddRange([CentreIndex(bases, rows, k - 2, j), c, CentreIndex(bases, rows, k + 2, j)]);
                if (j >= 2 && j + 2 < rows) s.AddRange([CentreIndex(bases, rows, k, j - 2), c, CentreIndex(bases, rows, k, j + 2)]);
            }
        return s.ToArray();
    }
}
