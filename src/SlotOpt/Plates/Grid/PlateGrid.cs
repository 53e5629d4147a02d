using SlotOpt.Tables;
using System.Runtime.CompilerServices;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// The plate rasterised on a uniform lattice over the outline's bounding box: per cell the
/// relative sheet conductance g = (conducting area fraction, thickness-weighted by grooves)
/// x (conductivity factor), and the thickness fraction used to turn sheet current into current
/// density. Cells with g below <see cref="VoidThreshold"/> count as non-conducting.
/// </summary>
public sealed class PlateGrid
{
    /// <summary>
    /// Below 1 % of a full cell's conductance a cell is treated as empty: dropping it changes the
    /// loss by less than it changes the outline's area (&lt; 1 % of one cell), and it keeps the
    /// operator's coefficient contrast (1/g) at most 100. Common practice, no source.
    /// </summary>
    public const double VoidThreshold = 0.01;

    public CellLattice Lattice { get; }
    /// <summary>Relative sheet conductance per cell, row-major (j * nx + i); 0 = non-conducting.</summary>
    public double[] Conductance { get; }
    /// <summary>Remaining thickness fraction per cell (1 except under grooves).</summary>
    public float[] ThicknessFraction { get; }
    /// <summary>Conducting area fraction per cell (0 where the cell counts as empty).</summary>
    public float[] AreaFraction { get; }
    public IReadOnlyList<string> Notes { get; }
    public PlateGeometry Geometry { get; }

    private PlateGrid(PlateGeometry geometry, CellLattice lattice, double[] conductance, float[] thicknessFraction, float[] areaFraction, List<string> notes)
    {
        Geometry = geometry;
        Lattice = lattice;
        Conductance = conductance;
        ThicknessFraction = thicknessFraction;
        AreaFraction = areaFraction;
        Notes = notes;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static PlateGrid Build(PlateGeometry geometry, GridOptions? options = null)
    {
        options ??= new GridOptions();
        var notes = new List<string>();
        var lattice = ChooseLattice(geometry, options, notes);
        int cells = lattice.CellCount;
        var area = new double[cells];
        PolygonCoverage.Accumulate(geometry.Outline, lattice, 1, area);
        foreach (var hole in geometry.Cutouts) PolygonCoverage.Accumulate(hole, lattice, -1, area);
        foreach (var slot in geometry.Slots) PolygonCoverage.Accumulate(slot.ToPolygon(), lattice, -1, area);
        // thickness-weighted area: a groove removes (1 - remaining) of the thickness over its area
        var thick = geometry.Grooves.Count > 0 ? new double[cells] : null;
        foreach (var g in geometry.Grooves) PolygonCoverage.Accumulate(g.Area, lattice, -(1 - g.RemainingThicknessFraction), thick!);
        var factor = geometry.Zones.Count > 0 ? new double[cells] : null;
        foreach (var z in geometry.Zones) PolygonCoverage.Accumulate(z.Area, lattice, z.Factor - 1, factor!);

        var conductance = new double[cells];
        var thickness = new float[cells];
        var areaFraction = new float[cells];
        int voided = 0;
        for (int j = 0; j < lattice.Ny; j++)
            for (int i = 0; i < lattice.Nx; i++)
            {
                int c = j * lattice.Nx + i;
                double f = Math.Clamp(area[c], 0, 1);
                double ft = Math.Clamp(f + (thick?[c] ?? 0), 0, f);             // conducting area x mean thickness fraction
                double k = Math.Max(0, 1 + (factor?[c] ?? 0));                  // area-weighted conductivity factor
                if (geometry.ConductivityFactorAt is { } map)
                {
                    double m = map(new Vec2(lattice.CellCentreX(i), lattice.CellCentreY(j)));
                    if (!double.IsFinite(m) || m < 0) throw new InputException($"the conductivity factor map gave {m} at ({lattice.CellCentreX(i)}, {lattice.CellCentreY(j)}) m; it must be finite and >= 0");
                    k *= m;
                }
                double g = ft * k;
                if (g < VoidThreshold) { if (g > 1e-9) voided++; g = 0; }   // below 1e-9 is rounding of exact coverage
                conductance[c] = g;
                areaFraction[c] = g > 0 ? (float)f : 0f;
                thickness[c] = f > 0 ? (float)Math.Clamp(ft / f, 0, 1) : 1f;
            }
        if (voided > 0) notes.Add($"{voided} cells with less than {Numbers.Percent(VoidThreshold)} of a full cell's conductance were treated as empty");
        if (Array.TrueForAll(conductance, g => g == 0)) throw new InputException("the plate has no conducting area on this grid (all cells empty): check the outline, cut-outs and slots");
        return new PlateGrid(geometry, lattice, conductance, thickness, areaFraction, notes);
    }

    private static CellLattice ChooseLattice(PlateGeometry geometry, GridOptions options, List<string> notes)
    {
        var (min, max) = geometry.Bounds;
        double w = max.X - min.X, h = max.Y - min.Y;
        var features = GeometryFeatures.Of(geometry).Concat(options.SourceFeatures).ToList();
        foreach (var f in features)
            if (!(f.WidthM > 0)) throw new InputException($"{f.Name} has no width left ({Numbers.Of(f.WidthM * 1e3, "mm")}): check the outline, cut-outs, cuts, slots and poles");
        double cell;
        if (options.CellSizeM is { } requested)
        {
            if (!(requested > 0) || !double.IsFinite(requested)) throw new InputException($"the cell size must be a positive length (got {requested} m)");
            cell = requested;
            foreach (var kind in features.Where(f => f.WidthM / cell < options.CellsAcross(f.Kind)).GroupBy(f => f.Kind))
            {
                var worst = kind.MinBy(f => f.WidthM)!;
                int others = kind.Count() - 1;
                notes.Add($"{worst.Name} ({Numbers.Of(worst.WidthM * 1e3, "mm")}) gets only {Numbers.Sig(worst.WidthM / cell)} cells across (at least {options.CellsAcross(kind.Key)} recommended)" +
                    (others > 0 ? $", and {others} more of its kind too few" : "") +
                    ": expect a larger grid error there");
            }
            double count = Math.Ceiling(w / cell) * Math.Ceiling(h / cell);
            if (count > options.MaxCells)
                throw new InputException(
                    $"a {Numbers.Of(cell * 1e3, "mm")} cell needs {Numbers.Sig(count)} cells, about {Numbers.Of(count * GridOptions.BytesPerCellEstimate / 1e9, "GB")}; " +
                    $"the limit is {Numbers.Sig(options.MaxCells)} cells ({Numbers.Of(options.MaxCells * GridOptions.BytesPerCellEstimate / 1e9, "GB")}): choose a larger cell");
        }
        else
        {
            var finest = features.MinBy(f => f.WidthM / options.CellsAcross(f.Kind))!;
            cell = finest.WidthM / options.CellsAcross(finest.Kind);
            double count = Math.Ceiling(w / cell) * Math.Ceiling(h / cell);
            if (count > options.MaxAutoCells)
            {
                cell = Math.Sqrt(w * h / options.MaxAutoCells);
                while (Math.Ceiling(w / cell) * Math.Ceiling(h / cell) > options.MaxAutoCells) cell *= 1.01;
                notes.Add($"grid capped at {Numbers.Sig(options.MaxAutoCells)} cells: {finest.Name} ({Numbers.Of(finest.WidthM * 1e3, "mm")}) gets only {Numbers.Sig(finest.WidthM / cell)} cells across; give a cell size to refine");
            }
        }
        int nx = Math.Max(1, (int)Math.Ceiling(w / cell - 1e-9));
        int ny = Math.Max(1, (int)Math.Ceiling(h / cell - 1e-9));
        if (nx < 2 || ny < 2) throw new InputException($"a {cell} m cell leaves fewer than 2 cells across the plate ({w} m x {h} m)");
        return new CellLattice(min.X, min.Y, w / nx, h / ny, nx, ny);
    }
}
