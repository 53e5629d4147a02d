using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The plate rebuilt on a lattice <see cref="Factor"/> times coarser (its own sheet model, multigrid and reaction operator, the
/// reaction kernel of the coarse hats) with the bilinear transfer to the fine unknowns: the coarse level of
/// <see cref="TwoLevelAcPreconditioner"/>. Depends only on the geometry, so one serves every frequency and conductor of a
/// <see cref="ReactionOperator"/> (which builds it on the first AC solve and keeps it). Not thread-safe, as the operators it holds.
/// </summary>
internal sealed class CoarseOwnFieldLevel
{
    /// <summary>Coarse cell size over fine: measured on the slotted bench plate (256 x 256 cells), 4 gave 7 outer iterations at
    /// the least CPU (2: 7 iterations at more CPU, the coarse problem 4 times larger; 8: 9 iterations, the 20 mm slots narrower than a coarse cell).</summary>
    public const int Factor = 4;
    /// <summary>Fewest coarse cells across the plate's lattice for the coarse level to be worth building (below it: V-cycle only).</summary>
    public const int MinimumCoarseCells = 16;

    public SheetModel Model { get; }
    public ReactionOperator Reaction { get; }
    public LatticeTransfer Transfer { get; }
    /// <summary>Fine over coarse cell area: a smooth field's flux through a fine hat over that through a coarse hat at the same place.</summary>
    public double FluxScale { get; }
    /// <summary>Bytes held: the coarse multigrid, reaction operator and the transfer.</summary>
    public long Bytes => Model.Multigrid.Bytes + Reaction.Bytes + Transfer.Bytes;

    private CoarseOwnFieldLevel(SheetModel model, ReactionOperator reaction, LatticeTransfer transfer, double fluxScale)
    {
        Model = model;
        Reaction = reaction;
        Transfer = transfer;
        FluxScale = fluxScale;
    }

    /// <summary>The coarse level of the fine operator's plate, or null when its lattice has fewer than <see cref="Factor"/> x <see cref="MinimumCoarseCells"/> cells a side or the coarse plate has no unknowns.</summary>
    public static CoarseOwnFieldLevel? For(ReactionOperator fine, int factor = Factor)
    {
        var l = fine.Model.Lattice;
        if (Math.Min(l.Nx, l.Ny) < factor * MinimumCoarseCells) return null;
        return Build(fine.Model, factor);
    }

    /// <summary>The coarse level at any factor (tests use small plates).</summary>
    public static CoarseOwnFieldLevel? Build(SheetModel fine, int factor)
    {
        var l = fine.Lattice;
        var model = SheetModel.Build(fine.Grid.Geometry, new GridOptions { CellSizeM = factor * Math.Max(l.Hx, l.Hy) });
        if (model.Unknowns == 0) return null;
        var c = model.Lattice;
        return new CoarseOwnFieldLevel(model, ReactionOperator.Build(model), new LatticeTransfer(fine, model), l.Hx * l.Hy / (c.Hx * c.Hy));
    }
}
