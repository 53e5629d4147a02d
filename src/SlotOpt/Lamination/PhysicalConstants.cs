namespace SlotOpt.Lamination;

/// <summary>Constants shared by the physics.</summary>
public static class PhysicalConstants
{
    /// <summary>Vacuum permeability mu0 = 4 pi 1e-7 H/m (the pre-2019 exact value; the CODATA 2018 value differs by 5.5e-10 relative).</summary>
    public const double VacuumPermeability = 4e-7 * Math.PI;
}
