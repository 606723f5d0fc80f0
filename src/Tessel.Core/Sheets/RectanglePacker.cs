namespace Tessel.Core.Sheets;

/// <summary>Where a rectangle went: bin index, lower corner, and whether it was turned a quarter
/// (then it occupies Height x Width).</summary>
public readonly record struct RectanglePlacement(int Bin, double X, double Y, bool Turned);

/// <summary>How MaxRects scores a free rectangle for an item (Jylanki 2010, section 3.4).</summary>
public enum MaxRectsRule
{
    /// <summary>Best Short Side Fit: least leftover on the shorter side.</summary>
    BestShortSideFit,
    /// <summary>Best Long Side Fit: least leftover on the longer side.</summary>
    BestLongSideFit,
    /// <summary>Best Area Fit: smallest free rectangle that takes the item.</summary>
    BestAreaFit,
    /// <summary>Bottom-Left: lowest top edge, then leftmost (Tetris-like).</summary>
    BottomLeft,
}

/// <summary>Packs rectangles into as few equal bins as practical with the MaxRects method, quarter turns
/// allowed (Jylanki, "A Thousand Ways to Pack the Bin", 2010, sections 3.2-3.4). Items go in a sorted order
/// (ties by index) into the first open bin that takes them; <see cref="PackBest"/> tries several rules and
/// orders, as Jylanki recommends, and keeps the fewest bins.</summary>
public static class RectanglePacker
{
    private readonly record struct Rect(double X, double Y, double W, double H)
    {
        public bool Contains(Rect o) => o.X >= X - Eps && o.Y >= Y - Eps && o.X + o.W <= X + W + Eps && o.Y + o.H <= Y + H + Eps;
    }

    private const double Eps = 1e-9;

    /// <summary>Packs #N rectangles (width, height) into bins of binWidth x binHeight.</summary>
    /// <param name="fixedTurn">#N flags (or null): true keeps that rectangle as given (no quarter turn).</param>
    /// <returns>#N placements in input order.</returns>
    /// <exception cref="ArgumentException">When a rectangle fits an empty bin in no allowed turning.</exception>
    public static RectanglePlacement[] Pack(IReadOnlyList<(double Width, double Height)> items, double binWidth, double binHeight,
        IReadOnlyList<bool>? fixedTurn = null) =>
        Pack(items, binWidth, binHeight, fixedTurn, MaxRectsRule.BestShortSideFit, SortKeys[0]);

    private static readonly Func<(double W, double H), double>[] SortKeys =
    [
        it => it.W * it.H,
        it => Math.Max(it.W, it.H),
        it => it.W + it.H,
    ];

    /// <summary>Packs with every rule and three orders (decreasing area, longer side, perimeter) and keeps the
    /// placement with fewest bins, then the fullest last bin (so leftovers gather in one place); ties keep the
    /// earlier try, so the result is deterministic.</summary>
    public static RectanglePlacement[] PackBest(IReadOnlyList<(double Width, double Height)> items, double binWidth, double binHeight,
        IReadOnlyList<bool>? fixedTurn = null)
    {
        RectanglePlacement[]? best = null;
        int bestBins = int.MaxValue; double bestLast = double.NegativeInfinity;
        foreach (var key in SortKeys)
            foreach (var rule in Enum.GetValues<MaxRectsRule>())
            {
                var placed = Pack(items, binWidth, binHeight, fixedTurn, rule, key);
                int bins = placed.Length == 0 ? 0 : placed.Max(p => p.Bin) + 1;
                double last = Enumerable.Range(0, items.Count).Where(i => placed[i].Bin == bins - 1).Sum(i => items[i].Width * items[i].Height);
                if (bins < bestBins || (bins == bestBins && last < bestLast - 1e-9)) { best = placed; bestBins = bins; bestLast = last; }
            }
        return best!;
    }

    /// <summary>Packs with one rule and one order: items by decreasing <paramref name="sortKey"/>.</summary>
    public static RectanglePlacement[] Pack(IReadOnlyList<(double Width, double Height)> items, double binWidth, double binHeight,
        IReadOnlyList<bool>? fixedTurn, MaxRectsRule rule, Func<(double W, double H), double> sortKey)
    {
        var order = Enumerable.Range(0, items.Count)
            .OrderByDescending(i => sortKey(items[i])).ThenBy(i => i).ToArray();
        var bins = new List<List<Rect>>();
        var result = new RectanglePlacement[items.Count];
        foreach (int i in order)
        {
            var (w, h) = items[i];
            bool canTurn = fixedTurn is null || !fixedTurn[i];
            if (!FitsEmpty(w, h, binWidth, binHeight) && !(canTurn && FitsEmpty(h, w, binWidth, binHeight)))
                throw new ArgumentException($"rectangle {i} ({w:F1} x {h:F1} mm) is larger than the bin ({binWidth:F1} x {binHeight:F1} mm)");
            bool placed = false;
            for (int b = 0; b < bins.Count && !placed; b++)
                placed = TryPlace(bins[b], b, w, h, canTurn, rule, out result[i]);
            if (!placed)
            {
                bins.Add([new Rect(0, 0, binWidth, binHeight)]);
                TryPlace(bins[^1], bins.Count - 1, w, h, canTurn, rule, out result[i]);
            }
        }
        return result;
    }

    private static bool FitsEmpty(double w, double h, double bw, double bh) => w <= bw + Eps && h <= bh + Eps;

    private static bool TryPlace(List<Rect> free, int bin, double w, double h, bool canTurn, MaxRectsRule rule, out RectanglePlacement placement)
    {
        double bestShort = double.PositiveInfinity, bestLong = double.PositiveInfinity;
        Rect best = default;
        bool turned = false, found = false;
        foreach (var f in free)
        {
            for (int t = 0; t < (canTurn ? 2 : 1); t++)
            {
                double pw = t == 0 ? w : h, ph = t == 0 ? h : w;
                if (pw > f.W + Eps || ph > f.H + Eps) continue;
                double dx = f.W - pw, dy = f.H - ph;
                double shortLeft = Math.Min(dx, dy), longLeft = Math.Max(dx, dy);
                var (s, l) = rule switch
                {
                    MaxRectsRule.BestLongSideFit => (longLeft, shortLeft),
                    MaxRectsRule.BestAreaFit => (f.W * f.H - pw * ph, shortLeft),
                    MaxRectsRule.BottomLeft => (f.Y + ph, f.X),
                    _ => (shortLeft, longLeft),
                };
                if (s < bestShort - Eps || (Math.Abs(s - bestShort) <= Eps && l < bestLong - Eps))
                {
                    bestShort = s; bestLong = l; best = new Rect(f.X, f.Y, pw, ph); turned = t == 1; found = true;
                }
            }
        }
        placement = new RectanglePlacement(bin, best.X, best.Y, turned);
        if (!found) return false;
        SplitFree(free, best);
        return true;
    }

    /// <summary>MaxRects update: every free rectangle the new one overlaps is replaced by up to four
    /// maximal pieces around it; then free rectangles inside others are dropped.</summary>
    private static void SplitFree(List<Rect> free, Rect used)
    {
        var next = new List<Rect>();
        foreach (var f in free)
        {
            bool overlaps = used.X < f.X + f.W - Eps && used.X + used.W > f.X + Eps
                && used.Y < f.Y + f.H - Eps && used.Y + used.H > f.Y + Eps;
            if (!overlaps) { next.Add(f); continue; }
            if (used.X > f.X + Eps) next.Add(new Rect(f.X, f.Y, used.X - f.X, f.H));
            if (used.X + used.W < f.X + f.W - Eps) next.Add(new Rect(used.X + used.W, f.Y, f.X + f.W - used.X - used.W, f.H));
            if (used.Y > f.Y + Eps) next.Add(new Rect(f.X, f.Y, f.W, used.Y - f.Y));
            if (used.Y + used.H < f.Y + f.H - Eps) next.Add(new Rect(f.X, used.Y + used.H, f.W, f.Y + f.H - used.Y - used.H));
        }
        free.Clear();
        for (int i = 0; i < next.Count; i++)
        {
            bool contained = false;
            for (int j = 0; j < next.Count && !contained; j++)
                if (i != j && next[j].Contains(next[i]) && (!next[i].Contains(next[j]) || j < i)) contained = true;
            if (!contained) free.Add(next[i]);
        }
    }
}
