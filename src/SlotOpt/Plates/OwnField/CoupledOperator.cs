using System.Numerics;
using System.Runtime.CompilerServices;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The coupled thin-sheet system at unit reference conductance, u = psi / G:
/// AC, e^{j omega t}:   (A + j omega G R) u = -s      (Faraday around each dual cell with the eddy field's flux added)
/// moving, source frame: (A - v G Dx R) u = -s        (plate-frame d/dt = -v d/dx acting on the eddy field)
/// with A the resistance-limited operator of <see cref="SheetOperator"/> (real, SPD), R the reaction
/// operator (<see cref="ReactionOperator"/>, henry), G = sigma t. In Fourier space the two are
/// k^2 + j omega G (mu0/2)|k| and k^2 - j v G (mu0/2)|k| kx: the moving case is AC with omega = -kx v.
/// The preconditioner is the resistance-limited multigrid V-cycle (an approximate A^-1) on the real and
/// imaginary parts. The preconditioned spectrum is then 1 + j beta mu with mu real: for AC bounded by
/// omega G mu0/(2 k_min) and large only for the few plate-sized modes (GMRES deals with those outliers),
/// for a moving source up to v/w at every wavenumber (w = 2/(mu0 G)). So the moving case (<see cref="ConvectedOperator"/>,
/// real, solved in real arithmetic) first applies the
/// free-lattice factor Phi = A^/(A^ + c S^) by FFT (<see cref="ReactionOperator.CoupledFactor"/>, exact on an
/// unbounded uniform sheet): measured, it halves the iterations at v = w (bench: 21 to 10 per offset). For AC
/// it saved too few iterations (16 to 17 on the slotted bench plate, 17 to 12 on a disc) to pay for its FFT.
/// AC solves on lattices of 64 cells a side or more use the two-grid cycle of <see cref="TwoLevelAcPreconditioner"/> instead
/// (bench plate: 16 to 7 outer iterations). Why a coarse lattice rather than a few deflated modes: on the bench plate (128 x 128
/// cells) the preconditioned spectrum 1 + j c mu is a continuum, c mu from 0 to 1.6 with 40 values above 0.2, not a few outliers;
/// GMRES on such a segment converges by a factor 1/|w0 + sqrt(w0^2 - 1)| = 0.30 an iteration (w0 = -1 + 2j/(c mu_max), the segment
/// mapped to [-1, 1]), 15 iterations to 1e-8 as observed. Deflating the top 10, 20, 40 Ritz vectors of A^-1 R (60 Lanczos steps)
/// left 13, 12, 12 iterations (10 each with an exact A^-1), for a per-geometry cost of many solves. The additive two-level form
/// M^-1 = V + P (K_H^-1 - A_H^-1) P^T (no fine product, which would deflate exactly for Galerkin coarse operators on an invariant
/// space) made it worse with rediscretised coarse operators: 19 iterations at 4x coarser, 25 at 8x.
/// </summary>
internal sealed class CoupledOperator
{
    private readonly SheetModel _model;
    private readonly ReactionOperator _reaction;
    private readonly Complex _coefficient;
    private readonly Complex[] _work;
    private readonly double[] _re, _im, _zRe, _zIm;

    private CoupledOperator(SheetModel model, ReactionOperator reaction, Complex coefficient)
    {
        _model = model;
        _reaction = reaction;
        _coefficient = coefficient;
        int n = model.Unknowns;
        _work = new Complex[n];
        _re = new double[n]; _im = new double[n]; _zRe = new double[n]; _zIm = new double[n];
    }

    /// <summary>A + j omega G R.</summary>
    public static CoupledOperator Ac(SheetModel model, ReactionOperator reaction, double omega, double sheetConductanceS) =>
        new(model, reaction, new Complex(0, omega * sheetConductanceS));

    /// <summary>A - v G Dx R (real: see <see cref="ConvectedOperator"/>).</summary>
    public static ConvectedOperator Moving(SheetModel model, ReactionOperator reaction, double speedMPerS, double sheetConductanceS) =>
        new(model, reaction, -speedMPerS * sheetConductanceS);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Apply(Complex[] x, Complex[] y)
    {
        _reaction.ApplyR(x, _work);
        Split(x);
        var a = _model.Multigrid.Operator;
        a.Multiply(_re, _zRe);
        a.Multiply(_im, _zIm);
        for (int i = 0; i < y.Length; i++) y[i] = new Complex(_zRe[i], _zIm[i]) + _coefficient * _work[i];
    }

    /// <summary>z = M^-1 r: one multigrid V-cycle of A on each of the real and imaginary parts.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Precondition(Complex[] r, Complex[] z)
    {
        Split(r);
        _model.Multigrid.Apply(_re, _zRe);
        _model.Multigrid.Apply(_im, _zIm);
        for (int i = 0; i < r.Length; i++) z[i] = new Complex(_zRe[i], _zIm[i]);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Split(Complex[] x)
    {
        for (int i = 0; i < x.Length; i++) { _re[i] = x[i].Real; _im[i] = x[i].Imaginary; }
    }
}
