using SlotOpt.Numerics;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// UnionFind (the merging of a hole's or a cut's nodes into one unknown) against connected components
/// found by breadth-first search over the same random edges (a dense reference: the definition of a
/// component). Exact: both are integer bookkeeping.
/// </summary>
public class UnionFindTests
{
    [Theory]
    [InlineData(1, 50, 30)]
    [InlineData(2, 200, 150)]
    [InlineData(3, 10, 40)]
    public void ComponentsMatchBreadthFirstSearch(int seed, int n, int edges)
    {
        var random = new Random(seed);
        var pairs = Enumerable.Range(0, edges).Select(_ => (A: random.Next(n), B: random.Next(n))).ToList();
        var union = new UnionFind(n);
        foreach (var (a, b) in pairs) union.Union(a, b);

        var neighbours = Enumerable.Range(0, n).Select(_ => new List<int>()).ToArray();
        foreach (var (a, b) in pairs) { neighbours[a].Add(b); neighbours[b].Add(a); }
        var component = Enumerable.Repeat(-1, n).ToArray();
        var size = new List<int>();
        for (int start = 0; start < n; start++)
        {
            if (component[start] >= 0) continue;
            int id = size.Count, count = 0;
            var queue = new Queue<int>([start]);
            component[start] = id;
            while (queue.Count > 0)
            {
                int v = queue.Dequeue();
                count++;
                foreach (var w in neighbours[v])
                    if (component[w] < 0) { component[w] = id; queue.Enqueue(w); }
            }
            size.Add(count);
        }

        for (int a = 0; a < n; a++)
        {
            Assert.Equal(size[component[a]], union.SizeOf(a));
            for (int b = a + 1; b < n; b++) Assert.Equal(component[a] == component[b], union.Find(a) == union.Find(b));
        }
    }
}
