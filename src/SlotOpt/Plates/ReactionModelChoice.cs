using SlotOpt.Tables;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Plates;

/// <summary>
/// The automatic switch between the resistance-limited and the coupled thin-sheet model, from the
/// validity figures, for a wanted accuracy eps (default 1 %) of loss and drag:
/// <list type="bullet">
/// <item>Resistance-limited while Rm &lt;= sqrt(eps). The low-speed answer overstates drag by the
/// factor 1/(F/F_low): for a 2-D line current F/F_low = 1/(1 + Rm^2) = 1 - Rm^2 + ..., for an
/// axisymmetric source (2/Rm^2)(1 - 1/sqrt(1 + Rm^2)) = 1 - (3/4) Rm^2 + ... (J. R. Reitz, J. Appl. Phys. 41:2067, 1970,
/// closed forms re-derived from the thin-sheet reflection coefficient and expanded here); the line current is the more sensitive, so Rm^2 &lt;= eps bounds both
/// (Rm &lt;= 0.1 at 1 %). The thin disc in an AC field (ring reference in the tests) is gentler still:
/// 1 - 0.12 beta^2 with beta = omega mu0 G a / 2.</item>
/// <item>Thin sheet while t/delta &lt;= (630 eps)^(1/4). The 1-D skin-effect factor of a lamination is
/// F(x) = 1 - x^4/630 + ... (Lammeraner & Stafl, Eddy Currents, 1964; Stoll, The Analysis of Eddy Currents, 1974; the expansion of (3/x)(sinh x - sin x)/(cosh x - cos x)), so the field's variation across the thickness costs less
/// than eps below that ratio (1.58 at 1 %: F(1.5) = 0.992). For a moving source the skin depth is
/// delta_c = sqrt(2 L / (mu0 sigma v)) with L the source's length scale (height above the sheet, or
/// pole size): the thin-sheet results hold for t &lt;&lt; delta_c (W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992).</item>
/// </list>
/// </summary>
public static class ReactionModelChoice
{
    public const double DefaultAccuracy = 0.01;

    public static double ReynoldsThreshold(double accuracy) => Math.Sqrt(accuracy);                  // Rm^2 <= eps
    public static double ThicknessThreshold(double accuracy) => Math.Pow(630 * accuracy, 0.25);      // x^4/630 <= eps

    /// <summary>Model for an AC case: Validity.ForAc gives Rm = mu0 sigma t omega L / 2 and t/delta.</summary>
    public static ModelChoice ForAc(ConductingSheet conductor, double frequencyHz, double loopWidthM, double accuracy = DefaultAccuracy)
    {
        var v = Validity.ForAc(conductor, frequencyHz, loopWidthM);
        return Choose(v.ReynoldsNumber, v.ThicknessToSkinDepth!.Value, accuracy);
    }

    /// <summary>Model for a moving source of length scale sourceLengthM (height above the sheet or pole size): Rm = v / w, t / delta_c.</summary>
    public static ModelChoice ForMoving(ConductingSheet conductor, double speedMPerS, double sourceLengthM, double accuracy = DefaultAccuracy)
    {
        if (!(sourceLengthM > 0)) throw new InputException($"the source's length scale must be positive (got {sourceLengthM} m)");
        var v = Validity.ForMoving(conductor, speedMPerS);
        double deltaC = Math.Sqrt(2 * sourceLengthM / (Validity.Mu0 * conductor.RelativePermeability * conductor.ConductivitySPerM * speedMPerS));   // delta_c = sqrt(2 L / (mu0 sigma v))
        return Choose(v.ReynoldsNumber, conductor.ThicknessM / deltaC, accuracy);
    }

    /// <summary>
    /// The speed (m/s) above which <see cref="ForMoving"/> leaves the resistance-limited model: the lower of the speed where Rm = mu0 sigma t v / 2
    /// reaches <see cref="ReynoldsThreshold"/> (Rm grows as v) and the one where t / delta_c, delta_c = sqrt(2 L / (mu0 mu_r sigma v)), reaches
    /// <see cref="ThicknessThreshold"/> (it grows as sqrt v); both figures rise with speed, so the choice is resistance-limited at and below it.
    /// </summary>
    public static double ResistanceLimitedEndSpeed(ConductingSheet conductor, double sourceLengthM, double accuracy = DefaultAccuracy)
    {
        double mu0Sigma = Validity.Mu0 * conductor.ConductivitySPerM, t = conductor.ThicknessM, tLimit = ThicknessThreshold(accuracy);
        double byReynolds = 2 * ReynoldsThreshold(accuracy) / (mu0Sigma * t);                                          // mu0 sigma t v / 2 = Rm limit
        double byThickness = 2 * sourceLengthM * tLimit * tLimit / (mu0Sigma * conductor.RelativePermeability * t * t);   // t / delta_c = t/delta limit
        return Math.Min(byReynolds, byThickness);
    }

    /// <summary>The automatic choice, or the model the user asked for with what the validity figures call for in its reason.</summary>
    public static ModelChoice Forced(ModelChoice automatic, SheetModelKind? asked) =>
        asked is not { } kind || kind == automatic.Kind ? automatic
            : automatic with { Kind = kind, Reason = $"asked for; the validity figures call for {Name(automatic.Kind)} ({automatic.Reason})" };

    /// <summary>The model's name as the command line and the outputs spell it.</summary>
    public static string Name(SheetModelKind kind) => kind switch
    {
        SheetModelKind.ResistanceLimited => "resistance-limited",
        SheetModelKind.ThinSheetReaction => "own-field",
        SheetModelKind.ThickSlab => "thick-slab",
        _ => "thick",
    };

    public static ModelChoice Choose(double reynoldsNumber, double thicknessToSkinDepth, double accuracy = DefaultAccuracy)
    {
        if (!(accuracy > 0 && accuracy < 1)) throw new InputException($"the wanted accuracy must lie between 0 and 1 (got {accuracy})");
        if (!double.IsFinite(reynoldsNumber) || reynoldsNumber < 0 || !double.IsFinite(thicknessToSkinDepth) || thicknessToSkinDepth < 0)
            throw new InputException($"validity figures must be finite and >= 0 (got Rm = {reynoldsNumber}, t/delta = {thicknessToSkinDepth})");
        double rmLimit = ReynoldsThreshold(accuracy), tLimit = ThicknessThreshold(accuracy);
        if (thicknessToSkinDepth > tLimit)
            return new ModelChoice(SheetModelKind.BeyondThinSheet, reynoldsNumber, thicknessToSkinDepth, rmLimit, tLimit,
                $"t/delta = {Numbers.Sig(thicknessToSkinDepth)} > {Numbers.Sig(tLimit)}: the field does not cross the thickness uniformly and the thin-sheet models do not hold; AC cases need the layered thick-plate model");
        if (reynoldsNumber > rmLimit)
            return new ModelChoice(SheetModelKind.ThinSheetReaction, reynoldsNumber, thicknessToSkinDepth, rmLimit, tLimit,
                $"Rm = {Numbers.Sig(reynoldsNumber)} > {Numbers.Sig(rmLimit)}: the eddy currents' own field changes loss and drag by more than {Numbers.Percent(accuracy)}");
        return new ModelChoice(SheetModelKind.ResistanceLimited, reynoldsNumber, thicknessToSkinDepth, rmLimit, tLimit,
            $"Rm = {Numbers.Sig(reynoldsNumber)} <= {Numbers.Sig(rmLimit)} and t/delta = {Numbers.Sig(thicknessToSkinDepth)} <= {Numbers.Sig(tLimit)}: the resistance-limited model is within {Numbers.Percent(accuracy)}");
    }
}
