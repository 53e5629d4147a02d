namespace SlotOpt.Selection;

/// <summary>
/// The discrete loss-against-cost front, sorted by build cost ascending (so loss descending).
/// Complete when <see cref="Status"/> is Optimal and <see cref="IsCapped"/> is false: then every point
/// is non-dominated and every non-dominated (cost, loss) pair is a point.
/// </summary>
/// <param name="Status">Optimal when every solve was proven; FeasibleAtLimit when some point is only a
/// best-found (it may then be dominated); LimitReachedWithoutDesign when a sweep step found nothing in
/// its budget (the front may go on past the cheapest point listed).</param>
/// <param name="IsCapped">The sweep stopped at <see cref="MaxPoints"/> while cheaper points were still to be found.</param>
public sealed record TradeOffFront(IReadOnlyList<FrontPoint> Points, SelectionStatus Status, bool IsCapped, int MaxPoints);
