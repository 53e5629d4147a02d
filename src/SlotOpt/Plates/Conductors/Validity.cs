using SlotOpt.Tables;
namespace SlotOpt.Plates.Conductors;

/// <summary>
/// How far the resistance-limited thin-plate answer can be trusted. The magnetic Reynolds number
/// is mu0 sigma t v / 2 for a moving source (= v / w with w = 2/(mu0 sigma t), W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992)
/// or mu0 sigma t omega L / 2 for an AC field (L the widest current loop); t/delta with
/// delta = sqrt(2 / (omega mu0 mu_r sigma)).
/// Thresholds: Rm &gt; 0.3 — the thin-sheet drag of a line current is F/F_low = 1/(1 + Rm^2) and of an
/// axisymmetric source (2/Rm)(1 - 1/sqrt(1 + Rm^2)) (J. R. Reitz, J. Appl. Phys. 41:2067, 1970, closed forms re-derived from the thin-sheet reflection coefficient), so at
/// Rm = 0.3 the low-speed answer overstates drag by 6–9 %. t/delta &gt; 1 — beyond it the field no
/// longer crosses the thickness uniformly: the 1-D lamination correction F(t/delta) = (3/x)(sinh x - sin x)/(cosh x - cos x) (Lammeraner & Stafl, Eddy Currents, 1964; Stoll, The Analysis of Eddy Currents, 1974)
/// falls from 0.998 at 1 to 0.976 at 2 and 0.61 at 5.
/// </summary>
public sealed record Validity(double ReynoldsNumber, double? ThicknessToSkinDepth, IReadOnlyList<string> Warnings)
{
    public const double ReynoldsLimit = 0.3;
    public const double ThicknessToSkinDepthLimit = 1.0;
    public const double Mu0 = 4e-7 * Math.PI;

    public static Validity ForMoving(ConductingSheet c, double speedMPerS)
    {
        double rm = Mu0 * c.ConductivitySPerM * c.ThicknessM * speedMPerS / 2;   // Rm = mu0 sigma t v / 2
        var w = new List<string>();
        if (rm > ReynoldsLimit)
            w.Add($"magnetic Reynolds number {Numbers.Sig(rm)} > {Numbers.Sig(ReynoldsLimit)}: the eddy currents' own field is not negligible; the resistance-limited drag and loss are overstated (by about 6-9 % at 0.3, more above)");
        return new Validity(rm, null, w);
    }

    public static Validity ForAc(ConductingSheet c, double frequencyHz, double loopWidthM)
    {
        double omega = 2 * Math.PI * frequencyHz;
        double rm = Mu0 * c.ConductivitySPerM * c.ThicknessM * omega * loopWidthM / 2;   // Rm = mu0 sigma t omega L / 2
        double delta = Math.Sqrt(2 / (omega * Mu0 * c.RelativePermeability * c.ConductivitySPerM));   // skin depth
        double ratio = c.ThicknessM / delta;
        var w = new List<string>();
        if (rm > ReynoldsLimit)
            w.Add($"magnetic Reynolds number {Numbers.Sig(rm)} > {Numbers.Sig(ReynoldsLimit)} (strip width {Numbers.Of(loopWidthM * 1e3, "mm")}): the eddy currents screen the field; the resistance-limited loss is overstated");
        if (ratio > ThicknessToSkinDepthLimit)
            w.Add($"thickness/skin depth {Numbers.Sig(ratio)} > {Numbers.Sig(ThicknessToSkinDepthLimit)} (skin depth {Numbers.Of(delta * 1e3, "mm")}): the current crowds to the surfaces; the resistance-limited loss is overstated");
        return new Validity(rm, ratio, w);
    }
}
