namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// A uniformly magnetised permanent magnet, magnetised along its height (z, normal to the plate), with
/// magnetisation M = Br / mu0: positive remanence points the magnetisation away from the plate (+z), so the
/// face toward the plate is a south pole and Bz below it is positive. The magnet's own permeability is
/// taken as mu0 (rigid magnetisation: recoil permeability 1, common practice for NdFeB and ferrite, no source).
/// </summary>
public interface IPermanentMagnet
{
    double RemanenceT { get; }
    double HeightM { get; }
    /// <summary>Half the magnet's extent along x (the travel), for spacing rows.</summary>
    double HalfLengthXM { get; }
    /// <summary>Half the magnet's extent along y (across the travel).</summary>
    double HalfWidthYM { get; }
    double VolumeM3 { get; }

    /// <summary>The flux density at (x, y, z) relative to the magnet's centre (tesla), inside the magnet included.</summary>
    FluxDensityVector FluxDensityAt(double x, double y, double z);

    /// <summary>Bz alone at (x, y, z) relative to the magnet's centre (tesla): bit for bit the Z of <see cref="FluxDensityAt"/>, for the sources that use only Bz.</summary>
    double FluxDensityZAt(double x, double y, double z);
}
