using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// The hand-written CSR kernels (the storage of the sheet and thermal operators) against MathNet.Numerics'
/// dense products on small random sparse matrices. Tolerance 1e-12 relative to the largest entry: both
/// sides sum the same few products (at most 12 terms of size <= 1) in double precision, so they agree to
/// a few units of rounding (about 1e-15); 1e-12 leaves room for summation order and catches any wrong entry.
/// </summary>
public class SparseKernelTests
{
    internal static (CsrMatrix Csr, Matrix<double> Dense) RandomSparse(Random random, int rows, int columns, double density)
    {
        var dense = Matrix<double>.Build.Dense(rows, columns);
        var rowStart = new int[rows + 1];
        var columnIndex = new List<int>();
        var value = new List<double>();
        for (int i = 0; i < rows; i++)
        {
            for (int j = 0; j < columns; j++)
            {
                if (random.NextDouble() >= density) continue;
                double v = 2 * random.NextDouble() - 1;
                dense[i, j] = v;
                columnIndex.Add(j);
                value.Add(v);
            }
            rowStart[i + 1] = columnIndex.Count;
        }
        return (new CsrMatrix(rows, columns, rowStart, columnIndex.ToArray(), value.ToArray()), dense);
    }

    [Theory]
    [InlineData(1, 17, 13, 0.3)]
    [InlineData(2, 40, 40, 0.1)]
    [InlineData(3, 5, 30, 0.5)]
    public void MultiplyAndResidualMatchDenseProduct(int seed, int rows, int columns, double density)
    {
        var random = new Random(seed);
        var (a, dense) = RandomSparse(random, rows, columns, density);
        var x = Enumerable.Range(0, columns).Select(_ => 2 * random.NextDouble() - 1).ToArray();
        var b = Enumerable.Range(0, rows).Select(_ => 2 * random.NextDouble() - 1).ToArray();
        var expected = dense * Vector<double>.Build.DenseOfArray(x);
        var y = new double[rows];
        a.Multiply(x, y);
        var r = new double[rows];
        a.Residual(b, x, r);
        for (int i = 0; i < rows; i++)
        {
            Assert.Equal(expected[i], y[i], 1e-12);
            Assert.Equal(b[i] - expected[i], r[i], 1e-12);
        }
    }
}
