using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>A uniform normal field of peak PeakT at FrequencyHz and phase PhaseRad: dB/dt amplitude = j omega B̂, the same everywhere and at every depth.</summary>
public sealed record UniformAcField(double PeakT, double FrequencyHz, double PhaseRad = 0) : IDepthAcFieldSource
{
    public void Integrate(CellLattice lattice, double depthM, double[] nodeRe, double[] nodeIm)
    {
        if (!(FrequencyHz > 0) || !double.IsFinite(FrequencyHz)) throw new InputException($"the field's frequency must be positive (got {FrequencyHz} Hz)");
        if (!double.IsFinite(PeakT)) throw new InputException("the field's peak flux density is not finite");
        double omega = 2 * Math.PI * FrequencyHz;
        // j omega B̂ e^{j phi} = omega B̂ (-sin phi + j cos phi)
        double re = -omega * PeakT * Math.Sin(PhaseRad) * lattice.CellAreaM2;
        double im = omega * PeakT * Math.Cos(PhaseRad) * lattice.CellAreaM2;
        Array.Fill(nodeRe, re);
        Array.Fill(nodeIm, im);
    }
}
