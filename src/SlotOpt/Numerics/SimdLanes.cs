using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace SlotOpt.Numerics;

/// <summary>
/// One SIMD register of doubles as a kernel written once uses it (load, store, broadcast, element-wise + - *): a kernel generic over
/// it runs at the width its type argument names, and the JIT compiles one copy per width. Element-wise operations round each lane as
/// the scalar operation would (no fused multiply-add), so every width gives the same numbers bit for bit.
/// </summary>
internal interface ISimdLanes<TSelf> where TSelf : struct, ISimdLanes<TSelf>
{
    /// <summary>Doubles in one register.</summary>
    static abstract int Count { get; }

    /// <summary>a[i .. i + Count).</summary>
    static abstract TSelf Load(double[] a, int i);

    /// <summary>x in every lane.</summary>
    static abstract TSelf Broadcast(double x);

    /// <summary>a[i .. i + Count) := this.</summary>
    void Store(double[] a, int i);

    double this[int lane] { get; }

    static abstract TSelf operator +(TSelf x, TSelf y);
    static abstract TSelf operator -(TSelf x, TSelf y);
    static abstract TSelf operator *(TSelf x, TSelf y);
    static abstract TSelf operator -(TSelf x);
}

/// <summary>Lanes of <see cref="Vector{T}"/>: the runtime's portable width (4 doubles with AVX2, 2 with SSE2 or Arm NEON).</summary>
internal readonly struct PortableLanes : ISimdLanes<PortableLanes>
{
    private readonly Vector<double> _v;
    private PortableLanes(Vector<double> v) => _v = v;

    public static int Count => Vector<double>.Count;
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes Load(double[] a, int i) => new(new Vector<double>(a, i));
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes Broadcast(double x) => new(new Vector<double>(x));
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public void Store(double[] a, int i) => _v.CopyTo(a, i);
    public double this[int lane] => _v[lane];
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes operator +(PortableLanes x, PortableLanes y) => new(x._v + y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes operator -(PortableLanes x, PortableLanes y) => new(x._v - y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes operator *(PortableLanes x, PortableLanes y) => new(x._v * y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static PortableLanes operator -(PortableLanes x) => new(-x._v);
}

/// <summary>
/// Lanes of <see cref="Vector512{T}"/> (8 doubles), for processors with AVX-512, where the runtime keeps <see cref="Vector{T}"/> at
/// 256 bits unless told otherwise by an environment variable; use only where <see cref="Vector512.IsHardwareAccelerated"/>.
/// </summary>
internal readonly struct WideLanes : ISimdLanes<WideLanes>
{
    private readonly Vector512<double> _v;
    private WideLanes(Vector512<double> v) => _v = v;

    public static int Count => Vector512<double>.Count;
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes Load(double[] a, int i) => new(Vector512.Create(a, i));
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes Broadcast(double x) => new(Vector512.Create(x));
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public void Store(double[] a, int i) => _v.CopyTo(a, i);
    public double this[int lane] => _v[lane];
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes operator +(WideLanes x, WideLanes y) => new(x._v + y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes operator -(WideLanes x, WideLanes y) => new(x._v - y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes operator *(WideLanes x, WideLanes y) => new(x._v * y._v);
    [MethodImpl(MethodImplOptions.AggressiveInlining)] public static WideLanes operator -(WideLanes x) => new(-x._v);
}
