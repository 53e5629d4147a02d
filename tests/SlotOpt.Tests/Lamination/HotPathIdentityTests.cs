using SlotOpt.Lamination;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Lamination;

/// <summary>
/// The evaluation's hot path was made faster without changing a bit of its results: the skin-effect series stops once
/// its terms can no longer change the sums, and validity messages are worded when read. Checked against the forms
/// they replaced, written out here: the 8-term series of (sinh x - sin x)/2 = x^3/3! + x^7/7! + ... and
/// (cosh x - cos x)/2 = x^2/2! + x^6/6! + ... (F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x), R. L. Stoll, "The
/// Analysis of Eddy Currents", 1974), and the message text as it was formatted eagerly. Tolerance: exact equality
/// (the change is an optimisation, not a new approximation).
/// </summary>
public class HotPathIdentityTests
{
    private static double EightTermSeries(double x)
    {
        double x2 = x * x, x4 = x2 * x2;
        double num = 0, den = 0, termNum = x2 * x / 6, termDen = x2 / 2;
        for (var k = 0; k < 8; k++)
        {
            num += termNum;
            den += termDen;
            termNum *= x4 / ((4 * k + 4) * (4 * k + 5) * (4 * k + 6) * (4 * k + 7));
            termDen *= x4 / ((4 * k + 3) * (4 * k + 4) * (4 * k + 5) * (4 * k + 6));
        }
        return 3 / x * num / den;
    }

    [Fact]
    public void Skin_factor_below_one_skin_depth_equals_the_full_eight_term_series_bit_for_bit()
    {
        var random = new Random(11);
        for (int i = 0; i < 20000; i++)
        {
            double x = i < 10 ? Math.Pow(10, -i) * 0.999 : random.NextDouble();
            if (x == 0) continue;
            Assert.Equal(BitConverter.DoubleToInt64Bits(EightTermSeries(x)), BitConverter.DoubleToInt64Bits(SkinEffect.Factor(x)));
        }
    }

    // M270-35A's coefficients come from 50 Hz data (IEC 60404-8-4 grade, library row); at 400 Hz the extrapolation flag is raised.
    [Fact]
    public void A_flag_message_read_later_is_the_text_formatted_at_evaluation()
    {
        var steel = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");
        var loss = LaminationLossModel.Evaluate(steel, new SineWaveform(1.0, 400));
        var flag = Assert.Single(loss.Flags, f => f.Code == "coefficients-extrapolated");
        Assert.Equal($"400 Hz is far from the {SlotOpt.Tables.Numbers.Of(steel.CoefficientsFrequencyHz, "Hz")} data the hysteresis and excess coefficients of {steel.Grade} came from", flag.Message);
        Assert.Same(flag.Message, flag.Message);   // worded once
    }
}
