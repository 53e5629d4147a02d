namespace SlotOpt.Design;

/// <summary>Continuous loss of one part in watts, by origin. Drag power is force times speed.</summary>
public sealed record LossBreakdown(double HysteresisW, double ClassicalW, double ExcessW, double PlateEddyW, double DragPowerW)
{
    public static readonly LossBreakdown Zero = new(0, 0, 0, 0, 0);

    /// <summary>Lost power counted against the design: for a moving source the drag power is the eddy loss itself, so it is not added twice.</summary>
    public double TotalW => HysteresisW + ClassicalW + ExcessW + Math.Max(PlateEddyW, DragPowerW);
}
