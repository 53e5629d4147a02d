namespace SlotOpt.Numerics;

/// <summary>Disjoint sets over 0..n-1 with path halving and union by size.</summary>
internal sealed class UnionFind
{
    private readonly int[] _parent;
    private readonly int[] _size;

    public UnionFind(int n)
    {
        _parent = new int[n];
        _size = new int[n];
        for (int i = 0; i < n; i++) { _parent[i] = i; _size[i] = 1; }
    }

    public int Find(int a)
    {
        while (_parent[a] != a) { _parent[a] = _parent[_parent[a]]; a = _parent[a]; }
        return a;
    }

    public void Union(int a, int b)
    {
        a = Find(a); b = Find(b);
        if (a == b) return;
        if (_size[a] < _size[b]) (a, b) = (b, a);
        _parent[b] = a;
        _size[a] += _size[b];
    }

    public int SizeOf(int a) => _size[Find(a)];
}
