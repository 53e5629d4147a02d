using System.Runtime.CompilerServices;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// Exact area of a polygon inside each cell of a uniform grid. Per row of cells the polygon is
/// clipped to the row's strip (Sutherland–Hodgman, exact for any simple polygon as far as area goes:
/// the degenerate edges it may leave lie on the strip line and cancel), and the area left of every
/// vertical grid line is the edge integral A(X) = -sum over edges of the integral of y dx over the
/// part of the edge with x &lt;= X (the closing segment on x = X has dx = 0). Cell area = A(x_i+1) - A(x_i).
/// Cost per row: O(vertices + cells in the row).
/// </summary>
internal static class PolygonCoverage
{
    /// <summary>Adds weight * (area of polygon in cell) / (cell area) to target[j * nx + i].</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Accumulate(Polygon polygon, CellLattice lattice, double weight, double[] target)
    {
        var (min, max) = polygon.Bounds;
        int j0 = Math.Max(0, (int)Math.Floor((min.Y - lattice.Y0) / lattice.Hy));
        int j1 = Math.Min(lattice.Ny - 1, (int)Math.Floor((max.Y - lattice.Y0) / lattice.Hy));
        if (j1 < j0) return;
        int i0 = Math.Max(0, (int)Math.Floor((min.X - lattice.X0) / lattice.Hx));
        int i1 = Math.Min(lattice.Nx - 1, (int)Math.Floor((max.X - lattice.X0) / lattice.Hx));
        if (i1 < i0) return;
        var source = polygon.Vertices.ToArray();
        var strip = new List<Vec2>(source.Length + 8);
        var scratch = new List<Vec2>(source.Length + 8);
        int lines = i1 - i0 + 2;
        var leftArea = new double[lines];
        var step = new double[lines + 1];
        double cellArea = lattice.Hx * lattice.Hy;
        for (int j = j0; j <= j1; j++)
        {
            double ya = lattice.Y0 + j * lattice.Hy, yb = ya + lattice.Hy;
            ClipY(source, ya, keepAbove: true, scratch);
            ClipY(scratch, yb, keepAbove: false, strip);
            if (strip.Count < 3) continue;
            Array.Clear(leftArea);
            Array.Clear(step);
            for (int e = 0, prev = strip.Count - 1; e < strip.Count; prev = e++)
                AddEdge(strip[prev], strip[e], lattice, i0, lines, leftArea, step);
            double running = 0;
            for (int k = 0; k < lines; k++) { running += step[k]; leftArea[k] += running; }
            int row = j * lattice.Nx;
            for (int i = i0; i <= i1; i++)
            {
                double a = leftArea[i - i0 + 1] - leftArea[i - i0];
                if (a != 0) target[row + i] += weight * Math.Clamp(a / cellArea, 0, 1);
            }
        }
    }

    /// <summary>Contribution of edge p-&gt;q to A(X_k) for grid lines X_k = x0 + (i0 + k) hx.</summary>
    private static void AddEdge(Vec2 p, Vec2 q, CellLattice lattice, int i0, int lines, double[] leftArea, double[] step)
    {
        if (p.X == q.X) return;
        double sign = q.X > p.X ? -1 : 1;                 // -∫ y dx along the edge's direction
        var (l, r) = q.X > p.X ? (p, q) : (q, p);
        double slope = (r.Y - l.Y) / (r.X - l.X);
        double X(int k) => lattice.X0 + (i0 + k) * lattice.Hx;
        // kStart: first line with X > l.X; kEnd: first line with X >= r.X
        int kStart = Math.Clamp((int)Math.Floor((l.X - lattice.X0) / lattice.Hx) - i0, 0, lines);
        while (kStart < lines && X(kStart) <= l.X) kStart++;
        while (kStart > 0 && X(kStart - 1) > l.X) kStart--;
        int kEnd = Math.Clamp((int)Math.Floor((r.X - lattice.X0) / lattice.Hx) - i0, kStart, lines);
        while (kEnd < lines && X(kEnd) < r.X) kEnd++;
        while (kEnd > kStart && X(kEnd - 1) >= r.X) kEnd--;
        for (int k = kStart; k < kEnd; k++)
        {
            double x = X(k);
            double yx = l.Y + slope * (x - l.X);
            leftArea[k] += sign * (l.Y + yx) / 2 * (x - l.X);
        }
        if (kEnd < lines) step[kEnd] += sign * (l.Y + r.Y) / 2 * (r.X - l.X);
    }

    private static void ClipY(IReadOnlyList<Vec2> input, double yLine, bool keepAbove, List<Vec2> output)
    {
        output.Clear();
        int n = input.Count;
        if (n == 0) return;
        for (int i = 0; i < n; i++)
        {
            var cur = input[i];
            var prev = input[(i + n - 1) % n];
            bool curIn = keepAbove ? cur.Y >= yLine : cur.Y <= yLine;
            bool prevIn = keepAbove ? prev.Y >= yLine : prev.Y <= yLine;
            if (curIn)
            {
                if (!prevIn) output.Add(Cross(prev, cur, yLine));
                output.Add(cur);
            }
            else if (prevIn) output.Add(Cross(prev, cur, yLine));
        }
    }

    private static Vec2 Cross(Vec2 a, Vec2 b, double y)
    {
        double t = (y - a.Y) / (b.Y - a.Y);
        return new Vec2(a.X + t * (b.X - a.X), y);
    }
}
