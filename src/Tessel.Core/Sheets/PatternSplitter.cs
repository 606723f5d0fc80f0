using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Cuts a flat pattern into parts that each fit a rectangle, along crease lines: a part is a
/// connected set of whole faces, so every seam runs along mesh edges.</summary>
/// <remarks>Recursive strip splitting: a part that fits in no turning is turned to its minimum-area
/// rectangle and cut across its long side into k equal strips by face centroid, k being the fewest for
/// which every strip's faces fit the sheet's length (greedy maximal strips if no k up to four more does);
/// strips that fall apart become separate parts; each strip is treated the same way, so a pattern too
/// large both ways ends up as a grid of compact parts.</remarks>
public static class PatternSplitter
{
    /// <param name="faces">#F face polygons in mm (open rings).</param>
    /// <param name="neighbours">#F lists of faces that share an edge with each face.</param>
    /// <param name="width">Width every part must fit (mm), some turning allowed.</param>
    /// <param name="height">Height every part must fit (mm).</param>
    /// <returns>#F part number of each face, parts numbered 0.. in order of their lowest face index.</returns>
    /// <exception cref="InvalidOperationException">When a single face fits in no turning.</exception>
    public static int[] Split(Vec2[][] faces, int[][] neighbours, double width, double height)
    {
        var parts = new List<int[]>();
        foreach (var component in Components(Enumerable.Range(0, faces.Length).ToArray(), neighbours))
            SplitInto(component, faces, neighbours, width, height, parts);
        var ordered = parts.Select(p => p.OrderBy(f => f).ToArray()).OrderBy(p => p[0]).ToArray();
        var partOf = new int[faces.Length];
        for (int p = 0; p < ordered.Length; p++)
            foreach (int f in ordered[p]) partOf[f] = p;
        return partOf;
    }

    private static void SplitInto(int[] part, Vec2[][] faces, int[][] neighbours, double width, double height, List<int[]> parts)
    {
        var hull = MinimumAreaRectangle.ConvexHull(part.SelectMany(f => faces[f]).ToArray());
        if (MinimumAreaRectangle.FittingBox(hull, width, height) is not null) { parts.Add(part); return; }
        if (part.Length == 1)
            throw new InvalidOperationException($"face {part[0]} is larger than the usable sheet area at this scale; choose a larger sheet or a smaller scale");

        var box = MinimumAreaRectangle.Of(hull);
        double longSide = Math.Max(width, height), shortSide = Math.Min(width, height);
        // A strip as wide as the part must still fit across; if not, strips are cut to the short side
        // and the next level cuts them the other way.
        double stripRoom = box.Height <= shortSide ? longSide : shortSide;
        var order = part.OrderBy(f => Centroid(faces[f]).Rotated(box.Angle).X).ThenBy(f => f).ToArray();
        var centre = order.Select(f => Centroid(faces[f]).Rotated(box.Angle).X - box.Min.X).ToArray();
        var low = order.Select(f => faces[f].Min(v => v.Rotated(box.Angle).X)).ToArray();
        var high = order.Select(f => faces[f].Max(v => v.Rotated(box.Angle).X)).ToArray();

        // Fewest equal strips whose faces all fit the strip room; failing that, greedy maximal strips.
        List<int[]>? pieces = null;
        int kMin = Math.Max(2, (int)Math.Ceiling(box.Width / stripRoom - 1e-9));
        for (int k = kMin; k <= kMin + 4 && pieces is null; k++)
        {
            var strip = centre.Select(c => Math.Clamp((int)Math.Floor(c / (box.Width / k)), 0, k - 1)).ToArray();
            bool fits = true;
            for (int s = 0; s < k && fits; s++)
            {
                var members = Enumerable.Range(0, order.Length).Where(i => strip[i] == s).ToArray();
                if (members.Length > 0) fits = members.Max(i => high[i]) - members.Min(i => low[i]) <= stripRoom + 1e-9;
            }
            if (fits)
                pieces = Enumerable.Range(0, k).Select(s => Enumerable.Range(0, order.Length).Where(i => strip[i] == s).Select(i => order[i]).ToArray())
                    .Where(g => g.Length > 0).ToList();
        }
        if (pieces is null)
        {
            pieces = [];
            var current = new List<int>();
            double from = double.PositiveInfinity, to = double.NegativeInfinity;
            for (int i = 0; i < order.Length; i++)
            {
                double nf = Math.Min(from, low[i]), nt = Math.Max(to, high[i]);
                if (current.Count > 0 && nt - nf > stripRoom + 1e-9)
                {
                    pieces.Add(current.ToArray());
                    current.Clear();
                    nf = low[i]; nt = high[i];
                }
                current.Add(order[i]); from = nf; to = nt;
            }
            pieces.Add(current.ToArray());
        }
        if (pieces.Count < 2)
        {
            // One face spans the whole part: halve by centroid order instead so the recursion ends.
            pieces = [order[..(order.Length / 2)], order[(order.Length / 2)..]];
        }
        foreach (var piece in pieces)
            foreach (var component in Components(piece, neighbours))
                SplitInto(component, faces, neighbours, width, height, parts);
    }

    /// <summary>Connected pieces of a face set (through shared edges), each sorted, in order of lowest face.</summary>
    internal static List<int[]> Components(int[] set, int[][] neighbours)
    {
        var inSet = new HashSet<int>(set);
        var seen = new HashSet<int>();
        var result = new List<int[]>();
        foreach (int start in set.OrderBy(f => f))
        {
            if (!seen.Add(start)) continue;
            var component = new List<int> { start };
            var stack = new Stack<int>();
            stack.Push(start);
            while (stack.Count > 0)
                foreach (int n in neighbours[stack.Pop()])
                    if (inSet.Contains(n) && seen.Add(n)) { component.Add(n); stack.Push(n); }
            component.Sort();
            result.Add(component.ToArray());
        }
        return result;
    }

    /// <summary>Area centroid of a simple polygon (vertex mean if degenerate).</summary>
    internal static Vec2 Centroid(Vec2[] ring)
    {
        double a = 0, cx = 0, cy = 0;
        for (int i = 0; i < ring.Length; i++)
        {
            var p = ring[i]; var q = ring[(i + 1) % ring.Length];
            double c = Vec2.Cross(p, q);
            a += c; cx += (p.X + q.X) * c; cy += (p.Y + q.Y) * c;
        }
        if (Math.Abs(a) < 1e-12)
        {
            var sum = Vec2.Zero;
            foreach (var p in ring) sum += p;
            return sum / ring.Length;
        }
        return new Vec2(cx / (3 * a), cy / (3 * a));
    }
}
