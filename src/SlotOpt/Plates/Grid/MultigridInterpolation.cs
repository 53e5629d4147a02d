namespace SlotOpt.Plates.Grid;

/// <summary>
/// Operator-dependent prolongation for one coarsening step, after J. E. Dendy, "Black box
/// multigrid", J. Comput. Phys. 48 (1982) 366–386: a fine node between two coarse nodes on a
/// lattice line takes weights from its own matrix row, the connections on each side collapsed
/// across the line (w_side = -sum of a over that side's column / (a_uu + sum of a on the line
/// itself)), so that where a slot or a low-conductance groove cuts the line the weight across it
/// falls to near zero; a cell-centre node takes P_u = sum over its neighbours k of (-a_uk / a_uu) P_k.
/// Merged regions are injected. Where a row is ambiguous (a merged region on several sides, a
/// positive weight missing) the node falls back to bilinear weights.
/// </summary>
internal sealed class MultigridInterpolation
{
    public const int MaxEntries = 32;
    private readonly MultigridLevel _f;
    private readonly (int Index, double Weight)[][] _wx;
    private readonly (int Index, double Weight)[][] _wy;
    private readonly int[] _coarseNodeUnknown;
    private readonly int _ncx;
    private readonly int[] _mergedToCoarse;
    private readonly int[] _plainNode;

    public MultigridInterpolation(MultigridLevel fine, (int, double)[][] wx, (int, double)[][] wy, int[] coarseNodeUnknown, int ncx, int[] mergedToCoarse, int[] plainNode)
    {
        _f = fine; _wx = wx; _wy = wy; _coarseNodeUnknown = coarseNodeUnknown; _ncx = ncx; _mergedToCoarse = mergedToCoarse; _plainNode = plainNode;
    }

    public bool IsCentre(int u)
    {
        if (_f.IsMerged[u]) return false;
        int node = _plainNode[u];
        return _wx[node % _f.NodesX].Length == 2 && _wy[node / _f.NodesX].Length == 2;
    }

    /// <summary>Row of P for a merged region, a coarse-coincident node or an edge node; returns the entry count (&lt;= 2).</summary>
    public int FirstStage(int u, Span<int> cols, Span<double> vals)
    {
        if (_f.IsMerged[u]) { cols[0] = _mergedToCoarse[u]; vals[0] = 1; return 1; }
        int node = _plainNode[u];
        int i = node % _f.NodesX, j = node / _f.NodesX;
        var wx = _wx[i]; var wy = _wy[j];
        if (wx.Length == 1 && wy.Length == 1)
        {
            int c = Coarse(wx[0].Index, wy[0].Index);
            if (c < 0) return 0;
            cols[0] = c; vals[0] = 1;
            return 1;
        }
        bool alongX = wx.Length == 2;
        var (lowC, highC) = alongX ? (Coarse(wx[0].Index, wy[0].Index), Coarse(wx[1].Index, wy[0].Index))
                                   : (Coarse(wx[0].Index, wy[0].Index), Coarse(wx[0].Index, wy[1].Index));
        var (wl, wh) = alongX ? (wx[0].Weight, wx[1].Weight) : (wy[0].Weight, wy[1].Weight);
        if (TryCollapsedWeights(u, i, j, alongX, out double ol, out double oh)) { wl = ol; wh = oh; }
        int count = 0;
        if (lowC >= 0) { cols[count] = lowC; vals[count] = wl; count++; }
        if (highC >= 0)
        {
            if (count == 1 && cols[0] == highC) vals[0] += wh;
            else { cols[count] = highC; vals[count] = wh; count++; }
        }
        return count;
    }

    /// <summary>Row of P for a cell-centre node from the first-stage rows of its neighbours; bilinear when a neighbour is itself a centre node.</summary>
    public int Centre(int u, int[] firstCol, double[] firstVal, byte[] firstCount, Span<int> cols, Span<double> vals)
    {
        var a = _f.A;
        double diag = 0;
        for (int k = a.RowStart[u]; k < a.RowStart[u + 1]; k++) if (a.ColumnIndex[k] == u) diag = a.Value[k];
        int count = 0;
        bool ok = diag > 0;
        for (int k = a.RowStart[u]; ok && k < a.RowStart[u + 1]; k++)
        {
            int c = a.ColumnIndex[k];
            if (c == u) continue;
            if (IsCentre(c)) { ok = false; break; }
            double w = -a.Value[k] / diag;
            for (int q = 0; q < firstCount[c]; q++)
            {
                int cc = firstCol[2 * c + q];
                int hit = -1;
                for (int t = 0; t < count; t++) if (cols[t] == cc) { hit = t; break; }
                if (hit >= 0) vals[hit] += w * firstVal[2 * c + q];
                else if (count == MaxEntries) { ok = false; break; }
                else { cols[count] = cc; vals[count] = w * firstVal[2 * c + q]; count++; }
            }
        }
        if (ok) return count;
        int node = _plainNode[u];
        return Bilinear(node % _f.NodesX, node / _f.NodesX, cols, vals);
    }

    private bool TryCollapsedWeights(int u, int i, int j, bool alongX, out double low, out double high)
    {
        low = high = 0;
        var a = _f.A;
        double diag = 0, sumLow = 0, sumHigh = 0, sumMid = 0;
        for (int k = a.RowStart[u]; k < a.RowStart[u + 1]; k++)
        {
            int c = a.ColumnIndex[k];
            if (c == u) { diag = a.Value[k]; continue; }
            int side = SideOf(c, i, j, alongX);
            if (side == int.MinValue) return false;
            if (side < 0) sumLow += a.Value[k];
            else if (side > 0) sumHigh += a.Value[k];
            else sumMid += a.Value[k];
        }
        double d = diag + sumMid;
        if (!(d > 0) || sumLow > 0 || sumHigh > 0) return false;
        low = -sumLow / d;
        high = -sumHigh / d;
        return true;
    }

    /// <summary>-1, 0 or +1: on which side along the interpolation line unknown c lies among the 8 neighbours of (i, j); MinValue when on several sides or none.</summary>
    private int SideOf(int c, int i, int j, bool alongX)
    {
        int found = int.MinValue;
        for (int dj = -1; dj <= 1; dj++)
        {
            int jj = j + dj;
            if (jj < 0 || jj >= _f.NodesY) continue;
            for (int di = -1; di <= 1; di++)
            {
                int ii = i + di;
                if ((di == 0 && dj == 0) || ii < 0 || ii >= _f.NodesX) continue;
                if (_f.NodeUnknown[jj * _f.NodesX + ii] != c) continue;
                int side = alongX ? di : dj;
                if (found == int.MinValue) found = side;
                else if (found != side) return int.MinValue;
            }
        }
        return found;
    }

    private int Bilinear(int i, int j, Span<int> cols, Span<double> vals)
    {
        int count = 0;
        foreach (var (I, wI) in _wx[i])
            foreach (var (J, wJ) in _wy[j])
            {
                int c = Coarse(I, J);
                if (c < 0) continue;
                int hit = -1;
                for (int q = 0; q < count; q++) if (cols[q] == c) hit = q;
                if (hit >= 0) vals[hit] += wI * wJ;
                else { cols[count] = c; vals[count] = wI * wJ; count++; }
            }
        return count;
    }

    private int Coarse(int I, int J) => _coarseNodeUnknown[J * _ncx + I];
}
