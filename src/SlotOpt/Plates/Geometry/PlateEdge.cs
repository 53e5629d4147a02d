namespace SlotOpt.Plates.Geometry;

/// <summary>An edge of the plate's bounding box, from which slots enter.</summary>
public enum PlateEdge
{
    Bottom,
    Top,
    Left,
    Right,
}
