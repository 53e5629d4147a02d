using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// One coarsening step of black-box multigrid (J. E. Dendy, "Black box multigrid", J. Comput. Phys. 48 (1982) 366–386)
/// against the straightforward dense construction on small lattices with random couplings: the prolongation weights from
/// Dendy's formulas (section 3) evaluated on the dense fine matrix, and the coarse operator as the dense Galerkin product
/// P^T A P by MathNet.Numerics. Lattices of odd and even sides, from a 5-point level and again from the 9-point level it gives.
/// </summary>
public class BlackBoxCoarseningTests
{
    // odd and even sides; and lattices of few rows or columns, where the coarsening's row pass (prolongation one coarse row ahead of
    // the Galerkin product) starts, ends and meets the edges within a row or two; rows wide enough for the vector steps (four coarse
    // nodes a step) in both coarsenings, with scalar nodes left over at the row's end (26: 13 coarse columns, 11 inner; 21: 11, 9)
    public static TheoryData<int, int> Sides => new() { { 9, 7 }, { 8, 6 }, { 11, 10 }, { 12, 5 }, { 5, 13 }, { 4, 4 }, { 26, 11 }, { 21, 9 } };

    private static StencilLevel RandomFivePoint(int nx, int ny, int seed)
    {
        var random = new Random(seed);
        var level = new StencilLevel(nx, ny, ninePoint: false);
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int p = j * nx + i;
                // couplings over three decades, as slots and conductivity jumps make them
                if (i > 0) { double w = Math.Pow(10, 3 * random.NextDouble() - 2); level.West[p] = -w; level.Centre[p] += w; level.Centre[p - 1] += w; }
                if (j > 0) { double s = Math.Pow(10, 3 * random.NextDouble() - 2); level.South[p] = -s; level.Centre[p] += s; level.Centre[p - nx] += s; }
                level.Centre[p] += 0.01 * random.NextDouble();
            }
        return level;
    }

    private static Matrix<double> Dense(StencilLevel level)
    {
        int nx = level.Nx, n = level.Nodes;
        var a = Matrix<double>.Build.Dense(n, n);
        for (int j = 0; j < level.Ny; j++)
            for (int i = 0; i < nx; i++)
                for (int dj = -1; dj <= 1; dj++)
                    for (int di = -1; di <= 1; di++)
                    {
                        int ii = i + di, jj = j + dj;
                        if (ii >= 0 && jj >= 0 && ii < nx && jj < level.Ny) a[j * nx + i, jj * nx + ii] = level.Entry(i, j, di, dj);
                    }
        return a;
    }

    /// <summary>Dendy's prolongation on the dense fine matrix, straight from the formulas (fine node F, coarse node K).</summary>
    private static Matrix<double> DendyProlongation(Matrix<double> a, int fnx, int fny)
    {
        int ncx = (fnx + 1) / 2, ncy = (fny + 1) / 2;
        var prolongation = Matrix<double>.Build.Dense(fnx * fny, ncx * ncy);
        double A(int i, int j, int di, int dj) =>
            i + di >= 0 && j + dj >= 0 && i + di < fnx && j + dj < fny ? a[j * fnx + i, (j + dj) * fnx + i + di] : 0;
        double Ratio(double numerator, double d) => d > 0 ? -numerator / d : 0;
        // coarse nodes and the fine nodes on lines between them
        for (int j = 0; j < fny; j++)
            for (int i = 0; i < fnx; i++)
            {
                int f = j * fnx + i;
                bool evenI = i % 2 == 0, evenJ = j % 2 == 0;
                if (evenI && evenJ) prolongation[f, j / 2 * ncx + i / 2] = 1;
                else if (evenJ)
                {
                    double d = A(i, j, 0, 0) + A(i, j, 0, -1) + A(i, j, 0, 1);
                    prolongation[f, j / 2 * ncx + i / 2] = Ratio(A(i, j, -1, 0) + A(i, j, -1, -1) + A(i, j, -1, 1), d);
                    if (i + 1 < fnx) prolongation[f, j / 2 * ncx + i / 2 + 1] = Ratio(A(i, j, 1, 0) + A(i, j, 1, -1) + A(i, j, 1, 1), d);
                }
                else if (evenI)
                {
                    double d = A(i, j, 0, 0) + A(i, j, -1, 0) + A(i, j, 1, 0);
                    prolongation[f, j / 2 * ncx + i / 2] = Ratio(A(i, j, 0, -1) + A(i, j, -1, -1) + A(i, j, 1, -1), d);
                    if (j + 1 < fny) prolongation[f, (j / 2 + 1) * ncx + i / 2] = Ratio(A(i, j, 0, 1) + A(i, j, -1, 1) + A(i, j, 1, 1), d);
                }
            }
        // cell centres: -(sum over the 8 neighbours of a_k P_k) / a_C
        for (int j = 1; j < fny; j += 2)
            for (int i = 1; i < fnx; i += 2)
            {
                int f = j * fnx + i;
                for (int k = 0; k < ncx * ncy; k++)
                {
                    double sum = 0;
                    for (int dj = -1; dj <= 1; dj++)
                        for (int di = -1; di <= 1; di++)
                            if ((di != 0 || dj != 0) && i + di < fnx && j + dj < fny) sum += A(i, j, di, dj) * prolongation[(j + dj) * fnx + i + di, k];
                    prolongation[f, k] = Ratio(sum, A(i, j, 0, 0));
                }
            }
        return prolongation;
    }

    /// <summary>The stored prolongation as a dense matrix, by the kind of fine node (<see cref="StencilLevel"/>'s layout).</summary>
    private static Matrix<double> StoredProlongation(StencilLevel c, int fnx, int fny)
    {
        int ncx = c.Nx;
        var prolongation = Matrix<double>.Build.Dense(fnx * fny, c.Nodes);
        void Set(int i, int j, int k, double v) { if (i < fnx && j < fny) prolongation[j * fnx + i, k] = v; }
        for (int J = 0; J < c.Ny; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I, i = 2 * I, j = 2 * J;
                Set(i, j, k, 1);
                Set(i + 1, j, k, c.XLow![k]);
                if (I > 0) Set(i - 1, j, k, c.XHigh![k - 1]);
                Set(i, j + 1, k, c.YLow![k]);
                if (J > 0) Set(i, j - 1, k, c.YHigh![k - ncx]);
                Set(i + 1, j + 1, k, c.CentreSW![k]);
                if (I > 0) Set(i - 1, j + 1, k, c.CentreSE![k - 1]);
                if (J > 0) Set(i + 1, j - 1, k, c.CentreNW![k - ncx]);
                if (I > 0 && J > 0) Set(i - 1, j - 1, k, c.CentreNE![k - ncx - 1]);
            }
        return prolongation;
    }

    // Weights: the code stores them in single precision (relative rounding 6e-8, weights in [0, 1]) and forms the centre
    // weights from the stored line weights, so 1e-6 absolute bounds both roundings with room. Coarse operator: the same
    // products and sums as the dense P^T A P with the stored weights, in another order: 1e-13 relative to the largest entry.
    [Theory]
    [MemberData(nameof(Sides))]
    public void Coarsening_matches_Dendy_prolongation_and_the_dense_Galerkin_product(int nx, int ny)
    {
        var fine = RandomFivePoint(nx, ny, nx * 31 + ny);
        for (int step = 0; step < 2; step++)   // 5-point to 9-point, then 9-point to 9-point
        {
            var a = Dense(fine);
            var coarse = BlackBoxCoarsening.Coarsen(fine);
            var stored = StoredProlongation(coarse, fine.Nx, fine.Ny);
            var dendy = DendyProlongation(a, fine.Nx, fine.Ny);
            double weightError = (stored - dendy).Enumerate().Max(Math.Abs);
            Assert.True(weightError <= 1e-6, $"step {step}: prolongation differs from Dendy's formulas by {weightError:E2}");
            var galerkin = stored.Transpose() * a * stored;
            var ours = Dense(coarse);
            double scale = galerkin.Enumerate().Max(Math.Abs);
            double error = (ours - galerkin).Enumerate().Max(Math.Abs);
            Assert.True(error <= 1e-13 * scale, $"step {step}: coarse operator differs from P^T A P by {error / scale:E2} of its largest entry");
            fine = coarse;
        }
    }
}
