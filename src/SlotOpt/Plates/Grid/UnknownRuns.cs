using System.Runtime.CompilerServices;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// The lattice nodes of a plate's own (unmerged) unknowns as runs: nodes p .. p + n - 1 carry unknowns u .. u + n - 1 (<see cref="NodeRegions"/>
/// numbers them in node order, so a run is a stretch of plate between slots, holes and the edge, and may go on into the next row, which
/// follows it on the padded lattice). Moving a vector between the unknowns' numbering and the lattice is then a block copy a run instead of
/// a look-up a node. Merged regions' nodes and the outside are in no run: their callers handle them.
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

    /// <summary>lattice[pad + p] = values[u] for every node p of a run (its unknown u); other lattice entries untouched.</summary>
    public void ToLattice(ReadOnlySpan<double> values, Span<double> lattice, int pad)
    {
        for (int k = 0; k < _node.Length; k++) values.Slice(_unknown[k], _length[k]).CopyTo(lattice.Slice(pad + _node[k]));
    }

    /// <summary>values[u] = lattice[pad + p] for every node p of a run (its unknown u).</summary>
    public void FromLattice(ReadOnlySpan<double> lattice, int pad, Span<double> values)
    {
        for (int k = 0; k < _node.Length; k++) lattice.Slice(pad + _node[k], _length[k]).CopyTo(values.Slice(_unknown[k]));
    }

    /// <summary>values[u] = minuend[u] - lattice[pad + p] for every node p of a run (its unknown u).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void DifferenceFromLattice(ReadOnlySpan<double> minuend, ReadOnlySpan<double> lattice, int pad, Span<double> values)
    {
        for (int k = 0; k < _node.Length; k++)
        {
            var from = lattice.Slice(pad + _node[k], _length[k]);
            var b = minuend.Slice(_unknown[k], from.Length);
            var to = values.Slice(_unknown[k], from.Length);
            for (int i = 0; i < from.Length; i++) to[i] = b[i] - from[i];
        }
    }

    /// <summary>values[u] = lattice[pad + p] * scale (single-precision lattice) for every node p of a run (its unknown u).</summary>
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
