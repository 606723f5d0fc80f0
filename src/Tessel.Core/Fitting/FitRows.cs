using Tessel.Core.Fitting.Residuals;
using Tessel.Core.Geometry;
using Tessel.Core.Model;
using Tessel.Core.Targets;
using Tessel.Core.Tessellation;

namespace Tessel.Core.Fitting;

/// <summary>The rows of the fitting problem for one topology (precomputed once): which vertices each
/// row touches, its kind and its bounds; <see cref="Evaluate"/> fills values and analytic gradients.</summary>
/// <remarks>Every constraint row is scaled to be dimensionless (radians, scaled planarity, edge length
/// over the mean edge length h); objective rows are distances over h, so one penalty scale fits all.</remarks>
internal sealed class FitRows
{
    public int RowCount => Kind.Length;
    /// <summary>#R kind of each row.</summary>
    public ResidualKind[] Kind { get; }
    /// <summary>#R+1 offsets into <see cref="Vertices"/>.</summary>
    public int[] Start { get; }
    /// <summary>Vertices touched by each row, in gradient order.</summary>
    public int[] Vertices { get; }
    /// <summary>#R lower / upper bound of constraint rows (equality: both 0); objective rows unused.</summary>
    public double[] Lo { get; }
    public double[] Hi { get; }
    /// <summary>Index of the first constraint row; rows before it are objective rows.</summary>
    public int FirstConstraint { get; }
    /// <summary>Mean edge length of the draped mesh (metres): the length scale.</summary>
    public double Scale { get; }

    private readonly ITargetSurface _target;
    private readonly double _foldDepth;
    private readonly double _fairnessRoot;
    private readonly VertexStar[] _stars;
    private readonly int[] _aux;
    private readonly double[] _cornerScale;

    public FitRows(GeneratedPattern pattern, ITargetSurface target, double foldDepth, FitSettings s)
    {
        var mesh = pattern.Mesh;
        _target = target;
        _foldDepth = foldDepth;
        _fairnessRoot = Math.Sqrt(s.FairnessWeight);
        double sum = 0;
        for (int e = 0; e < mesh.EdgeCount; e++) sum += (mesh.Vertex(mesh.EdgeVertices[2 * e + 1]) - mesh.Vertex(mesh.EdgeVertices[2 * e])).Length;
        Scale = sum / mesh.EdgeCount;

        var kind = new List<ResidualKind>(); var start = new List<int> { 0 }; var verts = new List<int>();
        var lo = new List<double>(); var hi = new List<double>(); var aux = new List<int>();
        void Add(ResidualKind k, double l, double h, int a, params int[] vs)
        {
            kind.Add(k); verts.AddRange(vs); start.Add(verts.Count); lo.Add(l); hi.Add(h); aux.Add(a);
        }

        for (int v = 0; v < mesh.VertexCount; v++)
        {
            if (mesh.Layers[v] == VertexLayer.Top) Add(ResidualKind.TopDistance, 0, 0, 0, v);
            else if (mesh.Layers[v] == VertexLayer.Bottom) Add(ResidualKind.BottomDistance, 0, 0, 0, v);
        }
        var st = pattern.FairnessStencils;
        for (int k = 0; k < st.Length / 3; k++)
            for (int c = 0; c < 3; c++) Add(ResidualKind.Fairness, 0, 0, c, st[3 * k], st[3 * k + 1], st[3 * k + 2]);
        FirstConstraint = kind.Count;

        var cons = pattern.Constraints;
        if (cons.HasFlag(FamilyConstraints.QuadPlanarity))
            for (int f = 0; f < mesh.FaceCount; f++)
                if (mesh.Faces[f].Length == 4) Add(ResidualKind.Planarity, 0, 0, f, mesh.Faces[f]);
        _stars = VertexStar.InteriorStars(mesh);
        double eps = s.EpsilonDeg * Math.PI / 180;
        for (int i = 0; i < _stars.Length; i++)
        {
            int[] vs = [_stars[i].Center, .. _stars[i].Ring];
            if (cons.HasFlag(FamilyConstraints.Kawasaki) && _stars[i].Degree % 2 == 0) Add(ResidualKind.Kawasaki, 0, 0, i, vs);
            if (cons.HasFlag(FamilyConstraints.Developability)) Add(ResidualKind.Developability, -eps, eps, i, vs);
        }
        double deg = Math.PI / 180;
        foreach (var f in mesh.Faces)
            for (int k = 0; k < f.Length; k++)
                Add(ResidualKind.SectorAngleBound, s.MinSectorAngleDeg * deg, s.MaxSectorAngleDeg * deg, 0,
                    f[k], f[(k + 1) % f.Length], f[(k + f.Length - 1) % f.Length]);
        for (int e = 0; e < mesh.EdgeCount; e++)
        {
            int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
            double len = (mesh.Vertex(b) - mesh.Vertex(a)).Length;
            // The outline is held too, though a cut may be short: measured on a 12 x 12 reverse-curvature ring
            // sector at 1:50, a refit holding only the creases shrank an outline facet until it lay over its
            // neighbour in the flat layout (25 mm2), and the sheets were refused.
            double shortest = Math.Max(s.MinEdgeLengthFraction * len, Math.Min(s.MinEdgeLengthM, len));
            Add(ResidualKind.EdgeLengthBound, shortest / Scale, double.PositiveInfinity, e, a, b);
        }
        bool signs = cons.HasFlag(FamilyConstraints.FoldSigns), flats = cons.HasFlag(FamilyConstraints.FlatCreases);
        if (signs || flats)
            for (int e = 0; e < mesh.EdgeCount; e++)
            {
                var role = mesh.EdgeRoles[e];
                bool fold = signs && (role is CreaseRole.Mountain or CreaseRole.Valley), flat = flats && role == CreaseRole.Flat;
                if (!mesh.IsInterior(e) || !(fold || flat)) continue;
                int a = mesh.EdgeVertices[2 * e], b = mesh.EdgeVertices[2 * e + 1];
                int l = NextAfter(mesh.Faces[mesh.EdgeFaceLeft[e]], b), r = NextAfter(mesh.Faces[mesh.EdgeFaceRight[e]], a);
                double min = s.MinFoldAngleDeg * deg, max = s.MaxFoldAngleDeg * deg, flatHalfWidth = FitSettings.HeldFlatShare * s.DrawnFlatBelowDeg * deg;
                if (flat) Add(ResidualKind.FoldAngleBound, -flatHalfWidth, flatHalfWidth, e, a, b, l, r);
                else if (role == CreaseRole.Mountain) Add(ResidualKind.FoldAngleBound, min, max, e, a, b, l, r);
                else Add(ResidualKind.FoldAngleBound, -max, -min, e, a, b, l, r);
            }

        // Opposite corners of each quad turn the same way. Only with the planarity rows, which already
        // couple a quad's four corners (no new entries in the normal matrix); inactive on every sound facet.
        var cornerScale = new List<double>();
        if (cons.HasFlag(FamilyConstraints.QuadPlanarity))
            foreach (var f in mesh.Faces)
            {
                if (f.Length != 4) continue;
                for (int k = 0; k < 2; k++)
                {
                    int a = f[k], b = f[k + 1], c = f[k + 2], d = f[(k + 3) % 4];
                    Add(ResidualKind.FacetCornerOrder, 0, double.PositiveInfinity, cornerScale.Count, a, b, c, d);
                    cornerScale.Add(FacetCornerOrder.Scale(mesh.Positions, a, b, c, d));
                }
            }
        _cornerScale = cornerScale.ToArray();

        Kind = kind.ToArray(); Start = start.ToArray(); Vertices = verts.ToArray();
        Lo = lo.ToArray(); Hi = hi.ToArray(); _aux = aux.ToArray();
    }

    private static int NextAfter(int[] face, int v)
    {
        int k = Array.IndexOf(face, v);
        return face[(k + 1) % face.Length];
    }

    public bool IsConstraint(int row) => row >= FirstConstraint;

    /// <summary>Fills <paramref name="value"/> (#R) and <paramref name="grad"/> (3 per row vertex,
    /// aligned with <see cref="Vertices"/>). Objective rows give their residual (already weighted);
    /// constraint rows give the constrained quantity g, to be held in [Lo, Hi].</summary>
    public void Evaluate(double[] xyz, double[] value, double[] grad)
    {
        for (int r = 0; r < Kind.Length; r++)
        {
            int s0 = Start[r], nv = Start[r + 1] - s0;
            value[r] = EvaluateRow(r, xyz, grad.AsSpan(3 * s0, 3 * nv));
        }
    }

    /// <summary>Whether row <paramref name="r"/> is a bound: its gradient is used only while it binds.</summary>
    public bool IsBound(int r) => Kind[r] is ResidualKind.SectorAngleBound or ResidualKind.EdgeLengthBound
        or ResidualKind.FoldAngleBound or ResidualKind.FacetCornerOrder;

    /// <summary>As <see cref="Evaluate"/>, but the bound rows get their values only: most of them do not bind,
    /// and the fitter asks for the gradients of those that do (<see cref="FillGradient"/>) once it has
    /// weighted the rows. The values are the same numbers <see cref="Evaluate"/> gives.</summary>
    public void EvaluateWithoutBoundGradients(double[] xyz, double[] value, double[] grad)
    {
        for (int r = 0; r < Kind.Length; r++)
        {
            int s0 = Start[r], nv = Start[r + 1] - s0;
            value[r] = IsBound(r) ? BoundValue(r, xyz) : EvaluateRow(r, xyz, grad.AsSpan(3 * s0, 3 * nv));
        }
    }

    /// <summary>Fills the gradient of row <paramref name="r"/> at <paramref name="xyz"/> into its place in
    /// <paramref name="grad"/>.</summary>
    public void FillGradient(int r, double[] xyz, double[] grad)
    {
        int s0 = Start[r], nv = Start[r + 1] - s0;
        EvaluateRow(r, xyz, grad.AsSpan(3 * s0, 3 * nv));
    }

    /// <summary>The value of bound row <paramref name="r"/>, computed as <see cref="EvaluateRow"/> computes it.</summary>
    private double BoundValue(int r, double[] xyz)
    {
        var vs = Vertices.AsSpan(Start[r], Start[r + 1] - Start[r]);
        switch (Kind[r])
        {
            case ResidualKind.SectorAngleBound: return CornerAngle.Value(xyz, vs[0], vs[1], vs[2]);
            case ResidualKind.EdgeLengthBound: return EdgeLength.Value(xyz, vs[0], vs[1]) * (1 / Scale);
            case ResidualKind.FoldAngleBound: return FoldAngle.Value(xyz, vs[0], vs[1], vs[2], vs[3]);
            case ResidualKind.FacetCornerOrder: return FacetCornerOrder.Value(xyz, vs[0], vs[1], vs[2], vs[3], _cornerScale[_aux[r]]);
            default: throw new InvalidOperationException($"row kind {Kind[r]} is not a bound");
        }
    }

    /// <summary>Value of row <paramref name="r"/> at <paramref name="xyz"/>; its gradient (3 per row vertex)
    /// into <paramref name="gr"/>.</summary>
    public double EvaluateRow(int r, double[] xyz, Span<double> gr)
    {
        double invH = 1 / Scale;
        int s0 = Start[r], nv = Start[r + 1] - s0;
        var vs = Vertices.AsSpan(s0, nv);
        switch (Kind[r])
        {
            case ResidualKind.TopDistance:
            case ResidualKind.BottomDistance:
            {
                var sp = _target.ClosestPoint(Vec3.Read(xyz, vs[0]));
                double d = sp.SignedDistance + (Kind[r] == ResidualKind.BottomDistance ? _foldDepth : 0);
                (sp.Normal * invH).Write(gr, 0);
                return d * invH;
            }
            case ResidualKind.Fairness:
            {
                var xc = Vec3.Read(xyz, vs[1]);
                var n = _target.NormalAt(xc.X, xc.Y);
                var lap = Vec3.Read(xyz, vs[0]) - 2 * xc + Vec3.Read(xyz, vs[2]);
                var t = lap - Vec3.Dot(lap, n) * n;
                int c = _aux[r];
                double w = _fairnessRoot * invH;
                // Row c of the tangential projector I - n n^T.
                var unit = c == 0 ? new Vec3(1, 0, 0) : c == 1 ? new Vec3(0, 1, 0) : Vec3.UnitZ;
                var prow = unit - (c == 0 ? n.X : c == 1 ? n.Y : n.Z) * n;
                (w * prow).Write(gr, 0); (-2 * w * prow).Write(gr, 1); (w * prow).Write(gr, 2);
                return w * (c == 0 ? t.X : c == 1 ? t.Y : t.Z);
            }
            case ResidualKind.Planarity:
                return QuadPlanarity.Evaluate(xyz, vs[0], vs[1], vs[2], vs[3], gr);
            case ResidualKind.Kawasaki:
                return SectorAngleSums.Kawasaki(xyz, _stars[_aux[r]], gr);
            case ResidualKind.Developability:
                return SectorAngleSums.Developability(xyz, _stars[_aux[r]], gr);
            case ResidualKind.SectorAngleBound:
                return CornerAngle.Evaluate(xyz, vs[0], vs[1], vs[2], gr);
            case ResidualKind.EdgeLengthBound:
            {
                double value = EdgeLength.Evaluate(xyz, vs[0], vs[1], gr) * invH;
                for (int k = 0; k < 6; k++) gr[k] *= invH;
                return value;
            }
            case ResidualKind.FoldAngleBound:
                return FoldAngle.Evaluate(xyz, vs[0], vs[1], vs[2], vs[3], gr);
            case ResidualKind.FacetCornerOrder:
                return FacetCornerOrder.Evaluate(xyz, vs[0], vs[1], vs[2], vs[3], _cornerScale[_aux[r]], gr);
            default:
                throw new InvalidOperationException($"row kind {Kind[r]} has no evaluator");
        }
    }

    /// <summary>Symmetric Hessian of constraint row <paramref name="r"/> (3nv x 3nv, row-major, nv = row
    /// vertices) by forward differences of its analytic gradient. Needed for the constraints' curvature
    /// term sum_r lambda_r grad^2 g_r of the Lagrangian; differencing error ~1e-7 relative leaves the
    /// Newton step's fast convergence intact. <paramref name="xyz"/> is perturbed and restored.</summary>
    public void RowHessian(int r, double[] xyz, double[] hess, double[] g0, double[] g1)
    {
        int s0 = Start[r], nv = Start[r + 1] - s0, m = 3 * nv;
        EvaluateRow(r, xyz, g0.AsSpan(0, m));
        double step = 1e-7 * Scale;
        for (int j = 0; j < m; j++)
        {
            int coordinate = 3 * Vertices[s0 + j / 3] + j % 3;
            double saved = xyz[coordinate];
            xyz[coordinate] = saved + step;
            double actual = xyz[coordinate] - saved;
            EvaluateRow(r, xyz, g1.AsSpan(0, m));
            xyz[coordinate] = saved;
            for (int i = 0; i < m; i++) hess[i * m + j] = (g1[i] - g0[i]) / actual;
        }
        for (int i = 0; i < m; i++)
            for (int j = i + 1; j < m; j++)
            {
                double mean = 0.5 * (hess[i * m + j] + hess[j * m + i]);
                hess[i * m + j] = mean; hess[j * m + i] = mean;
            }
    }
}
