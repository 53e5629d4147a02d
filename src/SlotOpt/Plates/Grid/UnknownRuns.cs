using System.Runtime.CompilerServices;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// The lattice nodes of a plate's own (unmerged) unknowns as runs: nodes p .. p + n - 1 carry unknowns u .. u + n - 1 (<see cref="NodeRegions"/>
/// numbers them in node order, so a run is a stretch of plate between slots, holes and the edge, and may go on into the next row, which
/// follows it on the padded lattice). Moving a vector between the unknowns' numbering and the lattice is then a block copy a run instead of
/// a look-up a node: the one way the sheet operator, its conjugate gradients and its multigrid move vectors. Merged regions' nodes are in
/// no run: their callers handle them.
/// </summary>
internal sealed class UnknownRuns
{
    /// <summary>Run k: lattice nodes _node[k] .. _node[k] + _length[k] - 1, unknowns _unknown[k] .. _unknown[k] + _length[k] - 1.</summary>
    private readonly int[] _node, _unknown, _length;

    /// <param name="nodeUnknown">unknown of each node, -1 outside</param>
    /// <param name="mergedUnknown">the merged regions' unknowns (their nodes are left out)</param>
    public UnknownRuns(int[] nodeUnknown, int[] mergedUnknown)
    {
        var merged = new HashSet<int>(mergedUnknown);
        List<int> node = [], unknown = [], length = [];
        for (int p = 0; p < nodeUnknown.Length; p++)
        {
            int u = nodeUnknown[p];
            if (u < 0 || merged.Contains(u)) continue;
            int last = length.Count - 1;
            if (last >= 0 && node[last] + length[last] == p && unknown[last] + length[last] == u) length[last]++;
            else { node.Add(p); unknown.Add(u); length.Add(1); }
        }
        _node = [.. node];
        _unknown = [.. unknown];
        _length = [.. length];
    }

    public int Count => _node.Length;

    public long Bytes => 12L * _node.Length;

    /// <summary>Run k's lattice nodes, from node <paramref name="node"/> on, and unknowns, from <paramref name="unknown"/> on (<paramref name="length"/> of each).</summary>
    public void Run(int k, out int node, out int unknown, out int length)
    {
        node = _node[k];
        unknown = _unknown[k];
        length = _length[k];
    }

    /// <summary>lattice[pad + p] = values[u] for every node p of a run (its unknown u), 0 at every other entry of the padded lattice (the pads,
    /// the outside, the merged regions' nodes: their callers set those after), in one pass.</summary>
    public void ToLattice(ReadOnlySpan<double> values, Span<double> lattice, int pad)
    {
        int written = 0;   // lattice entries before it are set
        for (int k = 0; k < _node.Length; k++)
        {
            int at = pad + _node[k];
            lattice[written..at].Clear();
            values.Slice(_unknown[k], _length[k]).CopyTo(lattice[at..]);
            written = at + _length[k];
        }
        lattice[written..].Clear();
    }

    /// <summary>As <see cref="ToLattice(ReadOnlySpan{double}, Span{double}, int)"/>, with lattice[pad + p] = scale * values[u].</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ToLattice(ReadOnlySpan<double> values, Span<double> lattice, int pad, double scale)
    {
        int written = 0;
        for (int k = 0; k < _node.Length; k++)
        {
            int at = pad + _node[k];
            lattice[written..at].Clear();
            var from = values.Slice(_unknown[k], _length[k]);
            var to = lattice.Slice(at, from.Length);
            for (int i = 0; i < from.Length; i++) to[i] = scale * from[i];
            written = at + from.Length;
        }
        lattice[written..].Clear();
    }

    /// <summary>values[u] = scale * lattice[pad + p] for every node p of a run (its unknown u); the merged regions' entries untouched.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void FromLattice(ReadOnlySpan<double> lattice, int pad, double scale, Span<double> values)
    {
        for (int k = 0; k < _node.Length; k++)
        {
            var from = lattice.Slice(pad + _node[k], _length[k]);
            var to = values.Slice(_unknown[k], from.Length);
            for (int i = 0; i < from.Length; i++) to[i] = scale * from[i];
        }
    }

    /// <summary>values[u] = lattice[pad + p] * scale (single-precision lattice) for every node p of a run (its unknown u); the merged regions' entries untouched.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void FromLattice(ReadOnlySpan<float> lattice, int pad, double scale, Span<double> values)
    {
        for (int k = 0; k < _node.Length; k++)
        {
            var from = lattice.Slice(pad + _node[k], _length[k]);
            var to = values.Slice(_unknown[k], from.Length);
            for (int i = 0; i < from.Length; i++) to[i] = from[i] * scale;
        }
    }
}
