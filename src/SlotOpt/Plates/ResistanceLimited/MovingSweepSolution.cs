namespace SlotOpt.Plates.ResistanceLimited;

/// <summary>
/// A moving source solved at a set of travel offsets on one geometry, at unit reference sheet
/// conductance (1 S). Loss and drag per offset scale linearly with G = sigma t (see
/// <see cref="UnitConductanceSolution"/>); Peak keeps the full field of the offset with the largest loss.
/// </summary>
public sealed class MovingSweepSolution
{
    internal MovingSweepSolution(double[] offsetsXM, double[] lossPerSiemensW, int[] iterations, double speedMPerS, UnitConductanceSolution peak, IReadOnlyList<string> notes)
    {
        OffsetsXM = offsetsXM;
        LossPerSiemensW = lossPerSiemensW;
        IterationsPerOffset = iterations;
        SpeedMPerS = speedMPerS;
        Peak = peak;
        Notes = notes;
    }

    public double[] OffsetsXM { get; }
    public double[] LossPerSiemensW { get; }
    public int[] IterationsPerOffset { get; }
    public double SpeedMPerS { get; }
    public UnitConductanceSolution Peak { get; }
    public IReadOnlyList<string> Notes { get; }

    /// <summary>Mean over the offsets (uniformly spaced offsets over one slot pitch give the pitch average).</summary>
    public double MeanLossPerSiemensW => LossPerSiemensW.Average();

    public double[] DragN(double sheetConductanceS) => LossPerSiemensW.Select(p => sheetConductanceS * p / SpeedMPerS).ToArray();
    public double MeanDragN(double sheetConductanceS) => sheetConductanceS * MeanLossPerSiemensW / SpeedMPerS;
    public double MeanLossW(double sheetConductanceS) => sheetConductanceS * MeanLossPerSiemensW;

    /// <summary>Offsets k * pitch / count, k = 0..count-1: their mean is the average over one pitch (periodic midpoint rule).</summary>
    public static double[] OffsetsOverPitch(double pitchM, int count)
    {
        if (!(pitchM > 0) || count < 1) throw new InputException($"averaging over a pitch needs a positive pitch and at least one position (got {pitchM} m, {count})");
        return Enumerable.Range(0, count).Select(k => k * pitchM / count).ToArray();
    }

    /// <summary>count offsets evenly from fromXM to toXM inclusive, e.g. the whole pass of the poles over the plate.</summary>
    public static double[] OffsetsAcross(double fromXM, double toXM, int count)
    {
        if (count < 2 || !(toXM > fromXM)) throw new InputException($"a pass needs at least 2 positions over an increasing range (got {count}, {fromXM} to {toXM} m)");
        return Enumerable.Range(0, count).Select(k => fromXM + (toXM - fromXM) * k / (count - 1)).ToArray();
    }
}
