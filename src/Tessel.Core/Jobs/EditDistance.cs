namespace Tessel.Core.Jobs;

/// <summary>Levenshtein distance, used to suggest the field a user probably meant.</summary>
public static class EditDistance
{
    /// <summary>Minimum number of single-character insertions, deletions and substitutions turning
    /// <paramref name="a"/> into <paramref name="b"/>, ignoring letter case.</summary>
    public static int Between(string a, string b)
    {
        a = a.ToLowerInvariant(); b = b.ToLowerInvariant();
        var prev = new int[b.Length + 1];
        var cur = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) prev[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            cur[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                cur[j] = Math.Min(Math.Min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            (prev, cur) = (cur, prev);
        }
        return prev[b.Length];
    }

    /// <summary>The candidate nearest to <paramref name="word"/>, or null when none is close enough
    /// to be a plausible typo (distance above a third of the word's length, at least 2).</summary>
    public static string? Nearest(string word, IEnumerable<string> candidates)
    {
        string? best = null;
        int bestD = int.MaxValue;
        foreach (var c in candidates)
        {
            int d = Between(word, c);
            if (d < bestD) { bestD = d; best = c; }
        }
        int limit = Math.Max(2, word.Length / 3);
        return bestD <= limit ? best : null;
    }
}
