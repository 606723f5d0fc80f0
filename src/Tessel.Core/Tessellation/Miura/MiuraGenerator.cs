using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;

namespace Tessel.Core.Tessellation.Miura;

/// <summary>Makes the initial folded state of a Miura tessellation on a target: a regular sheet
/// (<see cref="RegularMiuraSheet"/> vertex layout, Schenk &amp; Guest 2013 cell) sized to the
/// footprint, turned to the requested orientation and draped: top-layer rows on the target, bottom
/// rows on the offset surface S - d n (Dudte et al., Nature Materials 2016).</summary>
public static class MiuraGenerator
{
    /// <summary>Builds and drapes the sheet. Throws <see cref="ArgumentException"/> naming the parameter
    /// and the fix when the parameters cannot make a Miura sheet on this footprint.</summary>
    public static GeneratedPattern Generate(ITargetSurface target, MiuraParameters p) =>
        Drape(target, p, PlanPoints(target.Footprint, p), "miura");

    /// <summary>Drapes the regular sheet with its vertices at the given plan points (one per vertex, in
    /// <see cref="RegularMiuraSheet"/> order): top layer on the target, bottom layer FoldDepth below it.</summary>
    /// <remarks>On a rectangle footprint the whole sheet is kept and its zig-zag overhangs the footprint by
    /// up to V; a target defined only over its footprint (a mesh, a height map) is sampled at the nearest
    /// footprint point there, which only moves the starting drape. On a polygon footprint the sheet,
    /// laid over the bounding box, is cut to the cells inside the polygon where the target has a
    /// surface (<see cref="FootprintTrim"/>).</remarks>
    public static GeneratedPattern Drape(ITargetSurface target, MiuraParameters p, Vec2[] plans, string family)
    {
        var fp = target.Footprint;
        var (cell, cellsX, cellsY) = ResolveCell(fp, p);
        var flat = RegularMiuraSheet.Build(cell, cellsX, cellsY);
        if (plans.Length != flat.VertexCount) throw new ArgumentException("one plan point per sheet vertex", nameof(plans));
        int nx = 2 * cellsX + 1, ny = 2 * cellsY + 1;
        bool trim = !fp.IsRectangle;
        var keep = new bool[flat.VertexCount];
        var pos = new double[flat.Positions.Length];
        double d = p.FoldDepth;
        for (int k = 0; k < flat.VertexCount; k++)
        {
            var plan = plans[k];
            if (trim)
            {
                keep[k] = FootprintTrim.Keeps(target, plan);
                // A dropped vertex only needs a finite place until the cut removes it.
                if (!keep[k]) { new Vec3(plan.X, plan.Y, 0).Write(pos, k); continue; }
            }
            var sample = double.IsFinite(target.HeightAt(plan.X, plan.Y))
                ? plan
                : new Vec2(Math.Clamp(plan.X, fp.MinX, fp.MaxX), Math.Clamp(plan.Y, fp.MinY, fp.MaxY));
            double z = target.HeightAt(sample.X, sample.Y);
            if (!double.IsFinite(z))
                throw new ArgumentException($"the sheet reaches ({plan.X:0.###}, {plan.Y:0.###}) m where the target has no surface; use a smaller footprint or a target that covers it", nameof(target));
            var onTarget = new Vec3(plan.X, plan.Y, z);
            var point = flat.Layers[k] == VertexLayer.Top ? onTarget : onTarget - d * target.NormalAt(sample.X, sample.Y);
            point.Write(pos, k);
        }
        var roles = new Dictionary<(int, int), CreaseRole>();
        for (int e = 0; e < flat.EdgeCount; e++) roles[(flat.EdgeVertices[2 * e], flat.EdgeVertices[2 * e + 1])] = flat.EdgeRoles[e];
        var mesh = new CreaseMesh(family, pos, flat.Faces, flat.Layers, (a, b) => roles[(a, b)]);
        var stencils = FairnessStencils(nx, ny);
        int anchor = AnchorVertex(nx, cellsX, cellsY);
        if (!trim)
            return new GeneratedPattern(mesh, FamilyConstraints.All, stencils, anchor, d)
            {
                Envelope = folded => TopEnvelope(folded, cellsX, cellsY),
            };
        var cut = FootprintTrim.Trim(mesh, keep, stencils, anchor);
        var envelope = EnvelopeGrid(cellsX, cellsY, cut.NewOfOld);
        return new GeneratedPattern(cut.Mesh, FamilyConstraints.All, cut.FairnessStencils, cut.AnchorVertex, d)
        {
            Envelope = envelope.Faces.Length == 0 ? null : folded => envelope.Build(folded),
        };
    }

    /// <summary>Plan position of every vertex of the regular sheet (<see cref="RegularMiuraSheet"/> order),
    /// turned to the orientation and centred, zig-zag included, on the footprint's bounding box.</summary>
    public static Vec2[] PlanPoints(Footprint fp, MiuraParameters p)
    {
        var (cell, cellsX, cellsY) = ResolveCell(fp, p);
        var flat = RegularMiuraSheet.Build(cell, cellsX, cellsY);
        double phi = p.OrientationDeg * Math.PI / 180;
        var centre = new Vec2(0.5 * (fp.MinX + fp.MaxX), 0.5 * (fp.MinY + fp.MaxY));
        var (u0, u1, v0, v1) = RotatedBounds(fp, centre, phi);
        var mid = new Vec2(0.5 * (u0 + u1) - cellsX * cell.S, 0.5 * (v0 + v1) - cellsY * cell.L - 0.5 * cell.V);
        var plans = new Vec2[flat.VertexCount];
        for (int k = 0; k < plans.Length; k++)
        {
            var local = flat.Vertex(k);
            plans[k] = centre + (mid + new Vec2(local.X, local.Y)).Rotated(phi);
        }
        return plans;
    }

    /// <summary>The regular cell whose plan size makes cellsX x cellsY cells span the footprint, with
    /// height H = fold depth and acute facet angle gamma; validates the parameters.</summary>
    public static (MiuraCell Cell, int CellsX, int CellsY) ResolveCell(Footprint footprint, MiuraParameters p)
    {
        if (!(p.SectorAngleDeg > 0 && p.SectorAngleDeg < 90))
            throw new ArgumentException($"SectorAngleDeg = {p.SectorAngleDeg} is outside (0, 90) degrees; choose an acute facet angle such as 60", nameof(p.SectorAngleDeg));
        if (!(p.FoldDepth > 0) || !double.IsFinite(p.FoldDepth))
            throw new ArgumentException($"FoldDepth = {p.FoldDepth} m must be a positive distance between the two vertex layers; use e.g. a tenth of the cell size", nameof(p.FoldDepth));
        if (!double.IsFinite(p.OrientationDeg))
            throw new ArgumentException("OrientationDeg must be a finite angle in degrees", nameof(p.OrientationDeg));
        double phi = p.OrientationDeg * Math.PI / 180;
        var centre = new Vec2(0.5 * (footprint.MinX + footprint.MaxX), 0.5 * (footprint.MinY + footprint.MaxY));
        var (u0, u1, v0, v1) = RotatedBounds(footprint, centre, phi);
        double w = u1 - u0, depth = v1 - v0;

        int cellsX = CellCount(p.CellsX, p.CellSize, w, nameof(p.CellsX));
        int cellsY = CellCount(p.CellsY, p.CellSize, depth, nameof(p.CellsY));
        double s = w / (2 * cellsX), l = depth / (2 * cellsY), h = p.FoldDepth;
        double gamma = p.SectorAngleDeg * Math.PI / 180;
        // sin(theta) = H / (a sin gamma) with a^2 = L^2 + H^2 must stay below 1: H < L tan(gamma).
        if (!(h < l * Math.Tan(gamma)))
            throw new ArgumentException($"FoldDepth = {h} m is too deep for a cell half-length of {l:0.####} m at {p.SectorAngleDeg} deg (the sheet would be folded shut); use a depth below {l * Math.Tan(gamma):0.####} m, fewer cells across, or a larger sector angle", nameof(p.FoldDepth));
        double a = Math.Sqrt(l * l + h * h);
        double theta = Math.Asin(h / (a * Math.Sin(gamma)));
        double ct = Math.Cos(theta), tg = Math.Tan(gamma);
        double b = s * Math.Sqrt(1 + ct * ct * tg * tg) / (ct * tg);
        return (new MiuraCell(a, b, gamma, theta), cellsX, cellsY);
    }

    private static int CellCount(int? count, double? cellSize, double extent, string name)
    {
        if (count is int c)
        {
            if (c < 1) throw new ArgumentException($"{name} = {c}: at least one cell is needed; use 1 or more", name);
            return c;
        }
        if (cellSize is not double size)
            throw new ArgumentException($"{name} is not given and neither is CellSize; give a cell count or a cell size in metres", name);
        if (!(size > 0) || !double.IsFinite(size))
            throw new ArgumentException($"CellSize = {size} m must be a positive length", nameof(MiuraParameters.CellSize));
        if (size > extent * (1 + 1e-12))
            throw new ArgumentException($"CellSize = {size} m is larger than the footprint ({extent:0.###} m across); use a cell size of at most {extent:0.###} m", nameof(MiuraParameters.CellSize));
        return Math.Max(1, (int)Math.Round(extent / size));
    }

    private static (double U0, double U1, double V0, double V1) RotatedBounds(Footprint fp, Vec2 centre, double phi)
    {
        double u0 = double.MaxValue, u1 = double.MinValue, v0 = double.MaxValue, v1 = double.MinValue;
        foreach (var c in fp.Corners)
        {
            var r = (c - centre).Rotated(-phi);
            u0 = Math.Min(u0, r.X); u1 = Math.Max(u1, r.X);
            v0 = Math.Min(v0, r.Y); v1 = Math.Max(v1, r.Y);
        }
        return (u0, u1, v0, v1);
    }

    /// <summary>Same-layer second differences: along a row every other vertex (i-2, i, i+2: the
    /// zig-zag repeats every two), across rows the direct neighbours (i, j-1..j+1, whose tangential
    /// second difference vanishes on the regular sheet: the layers differ only along the normal).</summary>
    private static int[] FairnessStencils(int nx, int ny)
    {
        var s = new List<int>();
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int c = j * nx + i;
                if (i >= 2 && i + 2 < nx) { s.Add(c - 2); s.Add(c); s.Add(c + 2); }
                if (j >= 1 && j + 1 < ny) { s.Add(c - nx); s.Add(c); s.Add(c + nx); }
            }
        return s.ToArray();
    }

    /// <summary>The top-layer vertex nearest the middle of the grid.</summary>
    private static int AnchorVertex(int nx, int cellsX, int cellsY)
    {
        // Rows with odd j form the top layer; the middle row is j = cellsY.
        int j = cellsY % 2 == 1 ? cellsY : cellsY - 1;
        return j * nx + cellsX;
    }

    /// <summary>The envelope through the top-layer vertices that carry no zig-zag offset (odd rows j,
    /// even columns i): a regular cellsY x (cellsX + 1) grid, split along one diagonal, whose angle
    /// defects are its discrete Gaussian curvature. (The zig-zag vertices are left out: skinny triangles
    /// through them can be non-convex even with every vertex on a sphere.)</summary>
    public static CreaseMesh TopEnvelope(CreaseMesh folded, int cellsX, int cellsY) =>
        EnvelopeGrid(cellsX, cellsY, null).Build(folded);

    /// <summary>The envelope's vertices (as indices into the folded mesh) and triangles.</summary>
    private sealed record EnvelopeLayout(int[] Source, int[][] Faces)
    {
        public CreaseMesh Build(CreaseMesh folded)
        {
            var pos = new double[3 * Source.Length];
            for (int v = 0; v < Source.Length; v++) folded.Vertex(Source[v]).Write(pos, v);
            return new CreaseMesh("envelope", pos, Faces, new VertexLayer[Source.Length], (_, _) => CreaseRole.Flat);
        }
    }

    /// <summary>The <see cref="TopEnvelope"/> grid; on a cut sheet (<paramref name="newOfOld"/> given) only
    /// the grid triangles whose three vertices were kept, over the kept vertices they use.</summary>
    private static EnvelopeLayout EnvelopeGrid(int cellsX, int cellsY, int[]? newOfOld)
    {
        int nx = 2 * cellsX + 1, cols = cellsX + 1, rows = cellsY;
        int Sheet(int t, int i) => (2 * t + 1) * nx + 2 * i;
        int Folded(int t, int i) => newOfOld is null ? Sheet(t, i) : newOfOld[Sheet(t, i)];
        var faces = new List<int[]>();
        for (int t = 0; t + 1 < rows; t++)
            for (int i = 0; i + 1 < cols; i++)
            {
                int[] a = [t * cols + i, t * cols + i + 1, (t + 1) * cols + i + 1], b = [t * cols + i, (t + 1) * cols + i + 1, (t + 1) * cols + i];
                foreach (var f in new[] { a, b })
                    if (f.All(g => Folded(g / cols, g % cols) >= 0)) faces.Add(f);
            }
        // Grid numbering t * cols + i, compacted to the vertices the faces use.
        var index = new Dictionary<int, int>();
        var source = new List<int>();
        for (int g = 0; g < cols * rows; g++)
        {
            bool used = newOfOld is null || faces.Any(f => f.Contains(g));
            if (!used) continue;
            index[g] = source.Count;
            source.Add(Folded(g / cols, g % cols));
        }
        return new EnvelopeLayout(source.ToArray(), faces.Select(f => f.Select(g => index[g]).ToArray()).ToArray());
    }
}
