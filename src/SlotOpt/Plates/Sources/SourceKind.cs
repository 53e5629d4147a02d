namespace SlotOpt.Plates.Sources;

/// <summary>AC (complex amplitudes, time-averaged loss) or a moving source (instantaneous, drag = loss / speed).</summary>
public enum SourceKind
{
    Ac,
    Moving,
}
