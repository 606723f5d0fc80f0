namespace Tessel.Core.LinearAlgebra;

/// <summary>Reverse Cuthill-McKee ordering (Cuthill &amp; McKee 1969; reversal: George 1971) with the
/// pseudo-peripheral start node of George &amp; Liu, "Computer Solution of Large Sparse Positive Definite
/// Systems", Prentice-Hall 1981, section 4.3. Narrows the band / envelope of a symmetric matrix.</summary>
public static class ReverseCuthillMcKee
{
    /// <summary>Ordering of the graph of a structurally symmetric square matrix (diagonal ignored).
    /// Returns newToOld (n entries): newToOld[k] is the original index of the k-th unknown.
    /// Deterministic: ties are broken by original index; components are taken in order of their
    /// lowest-numbered node.</summary>
    public static int[] Order(CsrMatrix a)
    {
        if (a.Rows != a.Columns) throw new ArgumentException("matrix must be square", nameof(a));
        int n = a.Rows;
        int[] start = a.RowStart, cols = a.ColumnIndices;
        var degree = new int[n];
        for (int i = 0; i < n; i++)
            for (int k = start[i]; k < start[i + 1]; k++)
                if (cols[k] != i) degree[i]++;

        var order = new int[n];
        var visited = new bool[n];
        var levelOf = new int[n];
        var queue = new int[n];
        var neighbours = new List<int>(64);
        int placed = 0;
        for (int seed = 0; seed < n; seed++)
        {
            if (visited[seed]) continue;
            int root = PseudoPeripheralNode(seed, start, cols, degree, levelOf, queue);

            // Cuthill-McKee breadth-first numbering, neighbours by increasing degree.
            int head = placed;
            order[placed++] = root;
            visited[root] = true;
            while (head < placed)
            {
                int v = order[head++];
                neighbours.Clear();
                for (int k = start[v]; k < start[v + 1]; k++)
                {
                    int u = cols[k];
                    if (u != v && !visited[u]) { visited[u] = true; neighbours.Add(u); }
                }
                neighbours.Sort((x, y) => degree[x] != degree[y] ? degree[x].CompareTo(degree[y]) : x.CompareTo(y));
                foreach (int u in neighbours) order[placed++] = u;
            }
        }
        Array.Reverse(order);
        return order;
    }

    /// <summary>George-Liu: from a start node, repeatedly move to a minimum-degree node of the last
    /// breadth-first level while the eccentricity grows.</summary>
    private static int PseudoPeripheralNode(int startNode, int[] start, int[] cols, int[] degree, int[] levelOf, int[] queue)
    {
        int root = startNode;
        int eccentricity = LevelStructure(root, start, cols, levelOf, queue, out int count);
        while (true)
        {
            int best = -1;
            for (int t = 0; t < count; t++)
            {
                int v = queue[t];
                if (levelOf[v] != eccentricity) continue;
                if (best < 0 || degree[v] < degree[best] || (degree[v] == degree[best] && v < best)) best = v;
            }
            for (int t = 0; t < count; t++) levelOf[queue[t]] = 0;
            int e = LevelStructure(best, start, cols, levelOf, queue, out count);
            if (e <= eccentricity)
            {
                for (int t = 0; t < count; t++) levelOf[queue[t]] = 0;
                return root;
            }
            root = best;
            eccentricity = e;
        }
    }

    /// <summary>Breadth-first levels from root over nodes whose levelOf is 0; queue[0..count) lists the
    /// reached nodes, levelOf their 1-based level (the caller resets it). Returns the deepest level.</summary>
    private static int LevelStructure(int root, int[] start, int[] cols, int[] levelOf, int[] queue, out int count)
    {
        count = 0;
        queue[count++] = root;
        levelOf[root] = 1;
        int head = 0, deepest = 1;
        while (head < count)
        {
            int v = queue[head++];
            for (int k = start[v]; k < start[v + 1]; k++)
            {
                int u = cols[k];
                if (levelOf[u] != 0) continue;
                levelOf[u] = levelOf[v] + 1;
                deepest = Math.Max(deepest, levelOf[u]);
                queue[count++] = u;
            }
        }
        return deepest;
    }
}
