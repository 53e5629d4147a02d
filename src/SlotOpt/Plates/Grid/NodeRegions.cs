using System.Runtime.CompilerServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// Maps grid nodes to unknowns of the stream function. Every node touching one non-conducting
/// region (a hole, a slot, a zero-width cut, or the outside) joins one merged unknown: no current
/// crosses a non-conducting cell's edges, so psi is one constant around it. The region that
/// reaches the grid's border is the outside, fixed at psi = 0 (unknown -1). A merged unknown's
/// equation, the sum of its nodes' equations, is Faraday's law around the loop through the
/// centres of the conducting cells that ring the hole.
/// </summary>
public sealed class NodeRegions
{
    /// <summary>Unknown of each node ((nx + 1) x (ny + 1), row-major), -1 for the outside.</summary>
    public int[] NodeUnknown { get; }
    public int UnknownCount { get; }
    /// <summary>True for unknowns that stand for a merged region (a hole or an enclosed cut).</summary>
    public bool[] IsMerged { get; }
    public int MergedCount { get; }

    private NodeRegions(int[] nodeUnknown, int unknownCount, bool[] isMerged)
    {
        NodeUnknown = nodeUnknown;
        UnknownCount = unknownCount;
        IsMerged = isMerged;
        MergedCount = isMerged.Count(m => m);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static NodeRegions Build(PlateGrid grid)
    {
        var l = grid.Lattice;
        int nxn = l.NodesX, nodes = l.NodeCount;
        int outside = nodes;                        // a virtual node for the outside
        var sets = new UnionFind(nodes + 1);
        for (int i = 0; i < nxn; i++) { sets.Union(outside, i); sets.Union(outside, l.Ny * nxn + i); }
        for (int j = 0; j < l.NodesY; j++) { sets.Union(outside, j * nxn); sets.Union(outside, j * nxn + l.Nx); }
        var g = grid.Conductance;
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
            {
                if (g[j * l.Nx + i] > 0) continue;
                int n00 = j * nxn + i;
                sets.Union(n00, n00 + 1);
                sets.Union(n00, n00 + nxn);
                sets.Union(n00, n00 + nxn + 1);
            }
        foreach (var cut in grid.Geometry.Cuts) MergeAlong(cut, l, sets);
        // Every slot is merged along its centre line, whatever its width: psi is one constant over a connected insulating region, and a slot
        // two or three cells wide at an angle to the lattice need not leave a connected chain of empty cells (it breaks into islands joined
        // by partly covered cells, a leaky slot with many merged unknowns that the multigrid converges on slowly); wider slots' centre
        // lines lie in empty cells already, so merging them changes nothing there.
        foreach (var slot in grid.Geometry.Slots) MergeAlong(slot.CentreLine, l, sets);

        var nodeUnknown = new int[nodes];
        var rootUnknown = new Dictionary<int, int>();
        int outsideRoot = sets.Find(outside);
        int next = 0;
        var merged = new List<bool>();
        for (int n = 0; n < nodes; n++)
        {
            int r = sets.Find(n);
            if (r == outsideRoot) { nodeUnknown[n] = -1; continue; }
            if (sets.SizeOf(r) == 1) { nodeUnknown[n] = next++; merged.Add(false); continue; }
            if (!rootUnknown.TryGetValue(r, out int u)) { u = next++; merged.Add(true); rootUnknown[r] = u; }
            nodeUnknown[n] = u;
        }
        return new NodeRegions(nodeUnknown, next, merged.ToArray());
    }

    /// <summary>Merges the 4-connected chain of nodes nearest the segment (end points rounded to the nearest node); compiled optimised on its
    /// first call (a call a slot or cut: tiered compilation would leave a process's first plates to tier-0 code).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void MergeAlong(CutLine cut, CellLattice l, UnionFind sets)
    {
        int Ix(double x) => Math.Clamp((int)Math.Round((x - l.X0) / l.Hx), 0, l.Nx);
        int Iy(double y) => Math.Clamp((int)Math.Round((y - l.Y0) / l.Hy), 0, l.Ny);
        var d = cut.End - cut.Start;
        double len = Math.Abs(d.X) / l.Hx + Math.Abs(d.Y) / l.Hy;
        int steps = Math.Max(1, (int)Math.Ceiling(4 * len));
        int pi = Ix(cut.Start.X), pj = Iy(cut.Start.Y);
        for (int s = 1; s <= steps; s++)
        {
            var p = cut.Start + ((double)s / steps) * d;
            int ci = Ix(p.X), cj = Iy(p.Y);
            if (ci == pi && cj == pj) continue;
            if (ci != pi && cj != pj)
            {
                sets.Union(pj * l.NodesX + pi, pj * l.NodesX + ci);   // step in x first to stay 4-connected
                pi = ci;
            }
            sets.Union(pj * l.NodesX + pi, cj * l.NodesX + ci);
            pi = ci; pj = cj;
        }
    }
}
