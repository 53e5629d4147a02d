using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The coupled operator of a source moving along x, A + c Dx R with c = -v G (see <see cref="CoupledOperator"/>
/// for the equations): real, as A and Dx R are (R's kernel is real and Dx a real difference), so the
/// moving solve runs in real arithmetic with real FFTs, half the work of a complex one. Its preconditioner is
/// the free-lattice factor Phi = A^/(A^ + c S^) (<see cref="ReactionOperator.CoupledFactor"/>, Hermitian in the
/// wavenumber, so real on real fields; applied on the smaller circular lattice <see cref="ReactionOperator.FactorConvolution"/>,
/// about a third of the exact product's FFT area) followed by one multigrid V-cycle of A.
/// </summary>
internal sealed class ConvectedOperator
{
    private readonly SheetModel _model;
    private readonly ReactionOperator _reaction;
    private readonly double _coefficient;
    private readonly Numerics.KernelSpectrum _factor;
    private readonly double[] _work, _product;

    internal ConvectedOperator(SheetModel model, ReactionOperator reaction, double coefficient)
    {
        _model = model;
        _reaction = reaction;
        _coefficient = coefficient;
        _factor = reaction.CoupledFactor(coefficient, convected: true);
        _work = new double[model.Unknowns];
        _product = new double[model.Unknowns];
    }

    public void Apply(double[] x, double[] y)
    {
        _reaction.ApplyDxR(x, _work);
        _model.Multigrid.Operator.Multiply(x, _product);
        for (int i = 0; i < y.Length; i++) y[i] = _product[i] + _coefficient * _work[i];
    }

    /// <summary>z = M^-1 r: the spectral factor Phi, then one multigrid V-cycle of A.</summary>
    public void Precondition(double[] r, double[] z)
    {
        _reaction.ApplyMultiplier(r, _work, _factor);
        _model.Multigrid.Apply(_work, z);
    }
}
