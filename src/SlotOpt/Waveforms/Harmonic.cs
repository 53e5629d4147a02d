namespace SlotOpt.Waveforms;

/// <summary>One term of B(t) = sum_n A_n sin(n omega t + phi_n): order n, amplitude A_n (T), phase phi_n (rad).</summary>
public readonly record struct Harmonic(int Order, double AmplitudeT, double PhaseRad);
