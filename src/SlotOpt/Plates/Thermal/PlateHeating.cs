using SlotOpt.Tables;
using System.Globalization;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Loss and temperature of a plate solved together: the eddy-current solve with each cell's
/// conductivity at that cell's temperature (a per-cell conductivity factor on the grid, so the
/// current pattern follows the conductivity distribution), the loss map heats the plate, the new
/// temperatures give new factors, until the factor each cell was solved with and the one its computed
/// temperature gives agree within <see cref="FactorTolerance"/> (relative; about 0.01 K for a linear
/// law with alpha = 0.001/K). The first solve uses the sheet's reference conductivity everywhere.
/// When a step grows the mismatch, the update is under-relaxed (halved, down to 1/16). Non-convergence,
/// a temperature outside the material's or the fluid's data, or NaN is a <see cref="NumericalFailureException"/>
/// with the history of the iteration. For moving poles the loss map is the mean over the travel offsets
/// (the plate's thermal time constant is taken as long against one pass; common practice, no source).
/// </summary>
public static class PlateHeating
{
    public const double FactorTolerance = 1e-5;
    public const int MaxIterations = 60;

    public static HeatedPlate SolveAc(PlateGeometry geometry, GridOptions? grid, IAcFieldSource source, ConductingSheet sheetAtReference,
        ThermalMaterial material, PlateCooling cooling, ConvergenceCriterion? criterion = null) =>
        Solve(geometry, grid, sheetAtReference, material, cooling, model =>
        {
            var solution = ResistanceLimitedSolver.SolveAc(model, source, criterion);
            return (CellLossMap.Of(solution, sheetAtReference.SheetConductanceS), solution.LossW(sheetAtReference.SheetConductanceS), solution, null);
        });

    public static HeatedPlate SolveMoving(PlateGeometry geometry, GridOptions? grid, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConductingSheet sheetAtReference,
        ThermalMaterial material, PlateCooling cooling, ConvergenceCriterion? criterion = null) =>
        Solve(geometry, grid, sheetAtReference, material, cooling, model =>
        {
            double g = sheetAtReference.SheetConductanceS;
            var (unitMap, sweep) = MeanCellLoss(model, source, offsetsXM, criterion);
            return (unitMap.Select(p => p * g).ToArray(), sweep.MeanLossW(g), null, sweep);
        });

    /// <summary>
    /// Moving poles on one model: the loss per cell at a sheet conductance of 1 S, averaged over the travel offsets
    /// (each offset solved alone, so its map is at hand), and the sweep of those solves.
    /// </summary>
    public static (double[] CellLossPerSiemensW, MovingSweepSolution Sweep) MeanCellLoss(SheetModel model, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConvergenceCriterion? criterion = null)
    {
        var mean = new double[model.Lattice.CellCount];
        var losses = new double[offsetsXM.Count];
        var iterations = new int[offsetsXM.Count];
        UnitConductanceSolution? peak = null;
        var notes = new List<string>();
        for (int k = 0; k < offsetsXM.Count; k++)
        {
            var one = ResistanceLimitedSolver.SolveMoving(model, source, [offsetsXM[k]], criterion);
            var cells = CellLossMap.Of(one.Peak, 1.0);
            var edges = new double[cells.Length];
            source.SubCellEdgeLossPerSiemens(model.Grid, offsetsXM[k], edges);   // a sharp source's sub-cell edge loss, in the cells that hold it (0 for a smooth one)
            for (int c = 0; c < mean.Length; c++) mean[c] += (cells[c] + edges[c]) / offsetsXM.Count;
            losses[k] = one.LossPerSiemensW[0];
            iterations[k] = one.IterationsPerOffset[0];
            if (peak is null || losses[k] > peak.LossPerSiemensW) peak = one.Peak;
            foreach (var n in one.Notes) if (!notes.Contains(n)) notes.Add(n);
        }
        return (mean, new MovingSweepSolution(offsetsXM.ToArray(), losses, iterations, source.SpeedMPerS, peak!, notes));
    }

    private static HeatedPlate Solve(PlateGeometry geometry, GridOptions? grid, ConductingSheet sheet, ThermalMaterial material, PlateCooling cooling,
        Func<SheetModel, (double[] CellLossW, double LossW, UnitConductanceSolution? Ac, MovingSweepSolution? Sweep)> eddy)
    {
        var c = CultureInfo.InvariantCulture;
        var history = new List<string>();
        double[]? used = null;            // conductivity factor per cell the eddy solve ran with (null: 1 everywhere)
        ThermalNetwork? network = null;
        PlateTemperature? last = null;
        double relax = 1, lastMismatch = double.PositiveInfinity;
        for (int iteration = 1; ; iteration++)
        {
            var factors = used;
            var model = factors is null ? SheetModel.Build(geometry, grid) : SheetModel.Build(geometry.WithConductivityFactor(CellLookup(factors, network!.Lattice)), grid);
            var (cellLoss, loss, ac, sweep) = eddy(model);
            if (!double.IsFinite(loss)) throw new NumericalFailureException($"electro-thermal coupling: the loss is not finite at iteration {iteration}");
            network ??= ThermalNetwork.Assemble(model.Grid, material.ThermalConductivityWPerMK, sheet.ThicknessM, cooling.Edges);
            PlateTemperature temperature;
            try { temperature = PlateTemperatureSolver.Solve(network, cellLoss, cooling, last); }
            catch (NumericalFailureException e) { throw new NumericalFailureException($"electro-thermal coupling, iteration {iteration} (loss {Numbers.Watts(loss)}): {e.Message}{Trail(history)}"); }
            history.Add($"{iteration}: loss {Numbers.Watts(loss)}, hottest {Numbers.Celsius(temperature.HottestK, "degC")}");
            last = temperature;   // the next thermal solve starts here

            var cellT = temperature.CellTemperatureK();
            var target = new double[cellT.Length];
            double mismatch = 0, tMin = double.PositiveInfinity, tMax = double.NegativeInfinity, weighted = 0;
            for (int k = 0; k < cellT.Length; k++)
            {
                if (double.IsNaN(cellT[k])) { target[k] = 1; continue; }
                tMin = Math.Min(tMin, cellT[k]);
                tMax = Math.Max(tMax, cellT[k]);
                weighted += cellLoss[k] * cellT[k];
                try { target[k] = material.ConductivityFactorAtK(cellT[k]); }
                catch (InputException e)
                {
                    throw new NumericalFailureException(
                        $"electro-thermal coupling: the plate reached {Numbers.Celsius(cellT[k], "degC")} at iteration {iteration}, beyond the resistivity data ({e.Message}): thermal runaway or a plate far too hot{Trail(history)}");
                }
                if (!(target[k] > 0) || !double.IsFinite(target[k])) throw new NumericalFailureException($"electro-thermal coupling: the conductivity factor at {Numbers.Celsius(cellT[k], "degC")} is {target[k]}");
                mismatch = Math.Max(mismatch, Math.Abs(target[k] - (factors?[k] ?? 1)) / target[k]);
            }
            if (mismatch <= FactorTolerance)
            {
                var notes = new List<string>();
                if (relax < 1) notes.Add($"the coupling was under-relaxed (factor {Numbers.Sig(relax)}) to converge");
                return new HeatedPlate(model, ac, sweep, loss, temperature, iteration, FactorTolerance, tMin, tMax, loss > 0 ? weighted / loss : cooling.AmbientK, notes);
            }
            if (iteration >= MaxIterations)
                throw new NumericalFailureException(string.Create(c,
                    $"electro-thermal coupling did not converge in {MaxIterations} iterations (conductivity mismatch {mismatch:E2}, tolerance {FactorTolerance:E0}){Trail(history)}"));
            if (mismatch > lastMismatch) relax = Math.Max(relax / 2, 1.0 / 16);
            lastMismatch = mismatch;
            var next = new double[target.Length];
            for (int k = 0; k < next.Length; k++) { double old = factors?[k] ?? 1; next[k] = old + relax * (target[k] - old); }
            used = next;
        }
    }

    /// <summary>The factor of the cell a point lies in (the grid evaluates the map at cell centres).</summary>
    private static Func<Vec2, double> CellLookup(double[] factor, CellLattice l) => p =>
    {
        int i = Math.Clamp((int)Math.Floor((p.X - l.X0) / l.Hx), 0, l.Nx - 1);
        int j = Math.Clamp((int)Math.Floor((p.Y - l.Y0) / l.Hy), 0, l.Ny - 1);
        return factor[j * l.Nx + i];
    };

    private static string Trail(List<string> history) =>
        history.Count == 0 ? "" : "; iterations: " + string.Join("; ", history.TakeLast(8));
}
