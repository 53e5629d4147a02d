namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// The disc angles a turning disc's torque and loss are averaged over, for plate files and problem files alike: positions spread evenly from 0
/// over one slot pitch of a slotted disc (its torque repeats with the pitch) or round the whole turn of a solid disc; by default one for a
/// solid disc (its torque does not depend on the angle) and <see cref="DefaultSlottedPositions"/> for a slotted one.
/// </summary>
public static class DiscAngles
{
    public const int DefaultSlottedPositions = 8;

    /// <summary>The number of angles when none is given: one for a solid disc (pitchRad null), eight for a slotted one.</summary>
    public static int DefaultPositions(double? pitchRad) => pitchRad is null ? 1 : DefaultSlottedPositions;

    /// <param name="pitchRad">one slot pitch of a slotted disc; null for a solid disc (angles round the whole turn)</param>
    /// <param name="positions">how many angles; null for <see cref="DefaultPositions"/></param>
    public static double[] Spread(double? pitchRad, int? positions)
    {
        var count = positions ?? DefaultPositions(pitchRad);
        if (count < 1) throw new ArgumentOutOfRangeException(nameof(positions), count, "a turning disc needs at least one angle");
        var period = pitchRad ?? 2 * Math.PI;
        return Enumerable.Range(0, count).Select(k => k * period / count).ToArray();
    }
}
