using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>Cuts a flat pattern into parts that each fit a rectangle, along crease lines: a part is a
/// connected set of whole faces, so every seam runs along mesh edges.</summary>
/// <remarks>Recursive strip splitting: a part that fits in no turning is turned to its minimum-area
/// rectangle and cut across its long side into k strips by face centroid, k being the fewest strips whose
/// length (less one face) fits the sheet; strips that fall apart become separate parts; each strip is
/// treated the same way, so a pattern too wide both ways ends up as a grid of compact parts.</remarks>
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
        double faceSize = part.Max(f => MinimumAreaRectangle.BoxAt(faces[f], box.Angle).Width);
        double usable = Math.Max(stripRoom - faceSize, stripRoom / 2);
        int k = Math.Max(2, (int)Math.Ceiling(box.Width / usable - 1e-9));

        var groups = new List<int>[k];
        for (int s = 0; s < k; s++) groups[s] = [];
        foreach (int f in part)
        {
            double x = Centroid(faces[f]).Rotated(box.Angle).X - box.Min.X;
            int s = Math.Clamp((int)Math.Floor(x / (box.Width / k)), 0, k - 1);
            groups[s].Add(f);
        }
        var pieces = groups.Where(g => g.Count > 0).Select(g => g.ToArray()).ToList();
        if (pieces.Count < 2)
        {
            // One face spans the whole part: halve by centroid order instead so the recursion ends.
            var sorted = part.OrderBy(f => Centroid(faces[f]).Rotated(box.Angle).X).ThenBy(f => f).ToArray();
            pieces = [sorted[..(sorted.Length / 2)], sorted[(sorted.Length / 2)..]];
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
