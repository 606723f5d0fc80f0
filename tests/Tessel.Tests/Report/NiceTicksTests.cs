using Tessel.Output.Report;

namespace Tessel.Tests.Report;

public class NiceTicksTests
{
    [Theory]
    [InlineData(0.42, 0.5)]
    [InlineData(4.2, 5)]
    [InlineData(0.8, 1)]
    [InlineData(1.5, 2)]
    [InlineData(30, 50)]
    [InlineData(0.001, 0.001)]
    public void StepsAreOneTwoOrFiveTimesAPowerOfTen(double raw, double step) => Assert.Equal(step, NiceTicks.Step(raw), 12);

    [Fact]
    public void RangeIsWidenedToWholeSteps()
    {
        var (lo, hi, ticks) = NiceTicks.For(0, 21);
        Assert.Equal(0, lo);
        Assert.Equal(25, hi);
        Assert.Equal(new double[] { 0, 5, 10, 15, 20, 25 }, ticks);
        var (lo2, hi2, t2) = NiceTicks.For(-0.13, 0.27, 4);
        Assert.Equal(-0.2, lo2, 12);
        Assert.Equal(0.3, hi2, 12);
        Assert.Equal(6, t2.Length);
        Assert.Contains(0.0, t2);
    }

    [Fact]
    public void LabelsShowTheStepsPrecision()
    {
        Assert.Equal("0.25", NiceTicks.Label(0.25, 0.05));
        Assert.Equal("15", NiceTicks.Label(15, 5));
        Assert.Equal("0.002", NiceTicks.Label(0.002, 0.001));
    }
}
