namespace SlotOpt.Numerics;

/// <summary>A square linear operator as the Krylov solvers use it: y = A x and r = b - A x.</summary>
public interface ILinearOperator
{
    int Rows { get; }
    void Multiply(ReadOnlySpan<double> x, Span<double> y);
    void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r);
}
