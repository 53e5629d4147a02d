using SlotOpt.Design;
using SlotOpt.Input.Toml;

namespace SlotOpt.Input;

/// <summary>The `loss_kind` key of a part: "no-load" or "load".</summary>
public static class LossKindWords
{
    public static LossKind? Read(TomlSection s) => s.OptionalChoice("loss_kind", ["no-load", "load"]) switch
    {
        "no-load" => LossKind.NoLoad,
        "load" => LossKind.Load,
        _ => null,
    };
}
