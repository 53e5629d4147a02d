namespace SlotOpt.Numerics;

/// <summary>z = M^-1 r for a symmetric positive definite M.</summary>
public interface IPreconditioner
{
    void Apply(ReadOnlySpan<double> r, Span<double> z);
}
