namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>A disc's speed in revolutions per minute (the files', flags' and reports' unit) and in rad/s (the solvers'): omega = 2 pi n / 60, the one conversion.</summary>
public static class RotationalSpeed
{
    /// <summary>omega = 2 pi n / 60 (rad/s from rpm: one revolution is 2 pi rad, ISO 80000-3).</summary>
    public static double RadPerSFromRpm(double rpm) => rpm * 2 * Math.PI / 60;

    /// <summary>n = 60 omega / (2 pi) (rpm from rad/s).</summary>
    public static double RpmFromRadPerS(double angularSpeedRadPerS) => angularSpeedRadPerS * 60 / (2 * Math.PI);
}
