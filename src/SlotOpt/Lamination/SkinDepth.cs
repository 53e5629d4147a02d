namespace SlotOpt.Lamination;

/// <summary>Electromagnetic skin depth of a linear conductor.</summary>
public static class SkinDepth
{
    /// <summary>delta = sqrt(2 rho / (omega mu0 mu_r)) (m); e.g. R. L. Stoll, The Analysis of Eddy Currents, 1974, ch. 1.</summary>
    public static double Of(double resistivityOhmM, double frequencyHz, double relativePermeability) =>
        Math.Sqrt(2 * resistivityOhmM / (2 * Math.PI * frequencyHz * PhysicalConstants.VacuumPermeability * relativePermeability));
}
