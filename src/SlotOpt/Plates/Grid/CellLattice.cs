namespace SlotOpt.Plates.Grid;

/// <summary>
/// The uniform cell lattice: nx x ny cells of hx x hy metres from (x0, y0); nodes sit on cell
/// corners, (nx + 1) x (ny + 1) of them, node (i, j) at (x0 + i hx, y0 + j hy).
/// </summary>
public readonly record struct CellLattice(double X0, double Y0, double Hx, double Hy, int Nx, int Ny)
{
    public int NodesX => Nx + 1;
    public int NodesY => Ny + 1;
    public int NodeCount => NodesX * NodesY;
    public int CellCount => Nx * Ny;
    public double CellAreaM2 => Hx * Hy;
    public double NodeX(int i) => X0 + i * Hx;
    public double NodeY(int j) => Y0 + j * Hy;
    public double CellCentreX(int i) => X0 + (i + 0.5) * Hx;
    public double CellCentreY(int j) => Y0 + (j + 0.5) * Hy;
}
