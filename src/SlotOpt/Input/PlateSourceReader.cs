using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input.Toml;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Input;

/// <summary>
/// Reads a plate's [source] table: kind = "uniform_ac" (peak, frequency, phase_deg), "field_map"
/// (file: CSV x_m,y_m,peak_flux_density_t,phase_deg relative to the problem file; frequency) or "moving_poles"
/// (pole = "circle" with radius | "rectangle" with pole_width, pole_height; flux_density, speed; x, y of
/// the first pole centre at offset 0, default: the row centred on the plate; count, pole_pitch;
/// positions (default 8); average = "slot_pitch" | "pass") or "magnets" (permanent magnets magnetised normal to the
/// plate: shape = "cuboid" with length along the travel and width across | "cylinder" with diameter; height (the
/// magnetised direction), remanence, gap from the magnets' face to the plate's near surface; speed; x, y of the
/// first magnet's centre at offset 0, default the row centred on the plate; count, pitch (centre to centre),
/// polarity = "alternating" (default) | "same"; positions; average). Shared by problem files and plate files.
/// </summary>
public static class PlateSourceReader
{
    /// <param name="defaultAverage">The averaging when the file does not say (a single plate without slots has no pitch to average over).</param>
    public static PlateExcitation? Read(TomlSection s, Polygon? outline, string baseDirectory, TravelAverage defaultAverage = TravelAverage.SlotPitch)
    {
        var kind = s.OptionalChoice("kind", ["uniform_ac", "field_map", "moving_poles", "magnets"]);
        if (kind is null && !s.Has("kind")) s.Error("kind", "missing: \"uniform_ac\", \"field_map\", \"moving_poles\" or \"magnets\"");
        PlateExcitation? result = kind switch
        {
            "uniform_ac" => UniformAc(s),
            "field_map" => FieldMapSource(s, baseDirectory),
            "moving_poles" => Moving(s, outline, defaultAverage),
            "magnets" => Magnets(s, outline, defaultAverage),
            _ => null,
        };
        s.RejectUnknownKeys();
        return result;
    }

    private static PlateExcitation? UniformAc(TomlSection s)
    {
        s.AcceptOldName("peak", "peak_flux_density");
        var peak = s.RequiredQuantity("peak_flux_density", QuantityKind.FluxDensity);
        if (peak is < 0) s.Error("peak_flux_density", "must be zero or positive");
        var frequency = s.PositiveQuantity("frequency", QuantityKind.Frequency, required: true);
        var phaseDeg = s.OptionalNumber("phase_deg") ?? 0;
        if (peak is null || frequency is null || peak < 0) return null;
        var field = s.Guard("peak_flux_density", () => new UniformAcField(peak.Value, frequency.Value, phaseDeg * Math.PI / 180));
        return field is null ? null : new PlateExcitation.AcField(field, frequency.Value);
    }

    private static PlateExcitation? FieldMapSource(TomlSection s, string baseDirectory)
    {
        var file = s.RequiredString("file");
        var frequency = s.PositiveQuantity("frequency", QuantityKind.Frequency, required: true);
        if (file is null || frequency is null) return null;
        try
        {
            return new PlateExcitation.AcField(FieldMapCsv.Read(Path.Combine(baseDirectory, file), frequency.Value), frequency.Value, file);
        }
        catch (InputException e)
        {
            s.Error("file", e.Message);
            return null;
        }
    }

    private static PlateExcitation? Moving(TomlSection s, Polygon? outline, TravelAverage defaultAverage)
    {
        var shape = s.OptionalChoice("pole", ["circle", "rectangle"]);
        if (shape is null && !s.Has("pole")) s.Error("pole", "missing: \"circle\" or \"rectangle\"");
        PoleFace? face = null;
        if (shape == "circle")
        {
            var r = s.PositiveQuantity("radius", QuantityKind.Length, required: true);
            if (r is { } radius) face = s.Guard("radius", () => PoleFace.Circle(radius));
        }
        else if (shape == "rectangle")
        {
            var w = s.PositiveQuantity("pole_width", QuantityKind.Length, required: true);
            var h = s.PositiveQuantity("pole_height", QuantityKind.Length, required: true);
            if (w is { } width && h is { } height) face = s.Guard("pole_width", () => PoleFace.Rectangle(width, height));
        }
        s.AcceptOldName("flux_density", "peak_flux_density");
        var flux = s.RequiredQuantity("peak_flux_density", QuantityKind.FluxDensity);
        var speed = s.PositiveQuantity("speed", QuantityKind.Speed, required: true);
        var count = (int)(s.OptionalInteger("count", 1, 1000) ?? 1);
        var pitch = s.PositiveQuantity("pole_pitch", QuantityKind.Length, required: count > 1);
        var x = s.OptionalQuantity("x", QuantityKind.Length);
        var y = s.OptionalQuantity("y", QuantityKind.Length);
        var positions = (int)(s.OptionalInteger("positions", 1, 10_000) ?? 8);
        var averageText = s.OptionalChoice("average", ["slot_pitch", "pass"]) ?? (defaultAverage == TravelAverage.Pass ? "pass" : "slot_pitch");
        if (face is null || flux is null || speed is null || outline is null || (count > 1 && pitch is null)) return null;
        if (count > 1 && pitch < 2 * face.HalfWidthXM)
        {
            s.Error("pole_pitch", "is smaller than the pole: neighbouring poles would overlap");
            return null;
        }

        var (min, max) = outline.Bounds;
        var rowLength = (count - 1) * (pitch ?? 0);
        var first = new Vec2(x ?? (min.X + max.X) / 2 - rowLength / 2, y ?? (min.Y + max.Y) / 2);
        if (2 * face.HalfHeightYM > max.Y - min.Y)
            s.Error(shape == "circle" ? "radius" : "pole_height", $"the pole ({2 * face.HalfHeightYM * 1e3:0.###} mm across the travel) is wider than the plate it moves over ({(max.Y - min.Y) * 1e3:0.###} mm): the path must carry the whole pole face");
        else if (first.Y - face.HalfHeightYM > max.Y || first.Y + face.HalfHeightYM < min.Y)
            s.Error("y", "puts the poles' path entirely off the plate");
        var poles = s.Guard("pole", () => MovingPoles.Row(face, first, count, pitch ?? 0, flux.Value, speed.Value));
        return poles is null ? null : new PlateExcitation.Moving(poles, averageText == "pass" ? TravelAverage.Pass : TravelAverage.SlotPitch, positions);
    }

    private static PlateExcitation? Magnets(TomlSection s, Polygon? outline, TravelAverage defaultAverage)
    {
        if (s.OptionalChoice("motion", ["linear", "rotation", "approach"]) is "rotation" or "approach")
            s.Error("motion", "a turning disc and an approaching magnet are for plate files (`slotopt plate`); a part of a problem file slides (motion = \"linear\")");
        var magnet = MagnetSourceReader.Magnet(s);
        var gap = s.PositiveQuantity("gap", QuantityKind.Length, required: true);
        var speed = s.PositiveQuantity("speed", QuantityKind.Speed, required: true);
        var positions = (int)(s.OptionalInteger("positions", 1, 10_000) ?? 8);
        var averageText = s.OptionalChoice("average", ["slot_pitch", "pass"]) ?? (defaultAverage == TravelAverage.Pass ? "pass" : "slot_pitch");
        var array = MagnetSourceReader.Row(s, magnet, gap, outline);
        if (array is null || speed is null) return null;
        return new PlateExcitation.Moving(new SlidingMagnets(array, speed.Value), averageText == "pass" ? TravelAverage.Pass : TravelAverage.SlotPitch, positions);
    }
}
