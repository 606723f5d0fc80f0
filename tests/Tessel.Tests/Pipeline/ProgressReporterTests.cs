using Tessel.Core.Pipeline;

namespace Tessel.Tests.Pipeline;

public class ProgressReporterTests
{
    [Fact]
    public void LinesCarryTheStageAndSilentSaysNothing()
    {
        var w = new StringWriter();
        var p = new ProgressReporter(w);
        p.Stage("fitting", "start 1 of 4");
        p.Step("residual 1e-3");
        for (int i = 1; i <= 100; i++) p.Fraction("iteration", i, 100);
        var lines = w.ToString().TrimEnd().Split('\n');
        Assert.Equal("[fitting] start 1 of 4", lines[0].TrimEnd('\r'));
        Assert.Equal("[fitting]   residual 1e-3", lines[1].TrimEnd('\r'));
        Assert.Equal(12, lines.Length); // ten progress lines for a hundred steps
        ProgressReporter.Silent.Stage("x", "y");
        Assert.False(ProgressReporter.Silent.IsVerbose);
    }
}

/// <summary>The reporter's timing, driven by a fake clock (no real time is measured or asserted).</summary>
public class ProgressReporterClockTests
{
    private sealed class FakeClock
    {
        public TimeSpan Now;
        public TimeSpan Read() => Now;
        public void Advance(double seconds) => Now += TimeSpan.FromSeconds(seconds);
    }

    private static Tessel.Core.Fitting.FitIteration Step(int index, double residual, double shapeRmsM = 0.004) =>
        new(index, "epsilon-constraint", 1, 0, shapeRmsM, residual, residual / 10, 0, 0, true, 0);

    [Fact]
    public void PlainLinesComeAtMostOnceASecondAndCarryTheFitFigures()
    {
        var clock = new FakeClock();
        var w = new StringWriter();
        var p = new ProgressReporter(w, live: false, clock.Read);
        p.Observe(new Tessel.Core.Fitting.FitSettings { MaxIterations = 300 });
        p.Stage("fit", "1 start(s)");
        // 40 steps, four a second, for ten seconds.
        for (int i = 0; i < 40; i++)
        {
            clock.Advance(0.25);
            p.FitStep(Step(i, 1e-2 * Math.Pow(10, -i / 8.0)));
        }
        var lines = w.ToString().TrimEnd().Split('\n').Skip(1).Select(l => l.TrimEnd('\r')).ToArray();
        Assert.Equal(10, lines.Length); // one line per second of the ten
        var steps = lines.Select(l => int.Parse(System.Text.RegularExpressions.Regex.Match(l, @"step (\d+):").Groups[1].Value)).ToArray();
        for (int i = 1; i < steps.Length; i++) Assert.Equal(4, steps[i] - steps[i - 1]);
        // Residual falls one decade every 8 steps: from 1e-2 * 10^(-3/8) at step 4 to 1e-10 is
        // 8 - 3/8 decades, 61 steps.
        Assert.Equal("[fit]   step 4: largest constraint residual 4.22E-3, shape RMS 4 mm, 1 s, about 61 steps left", lines[0]);
    }

    [Fact]
    public void ALongQuietStageStillSaysItIsWorking()
    {
        var clock = new FakeClock();
        var w = new StringWriter();
        var p = new ProgressReporter(w, live: false, clock.Read);
        p.Stage("checks", "panel collisions");
        for (int s = 0; s < 35; s++) { clock.Advance(1); p.Tick(); }
        var lines = w.ToString().TrimEnd().Split('\n').Select(l => l.TrimEnd('\r')).ToArray();
        Assert.Equal(["[checks] panel collisions", "[checks]   working, 10 s", "[checks]   working, 20 s", "[checks]   working, 30 s"], lines);
    }

    [Fact]
    public void OnATerminalTheStatusLineChangesEverySecondEvenWhenStepsAreSlow()
    {
        var clock = new FakeClock();
        var w = new StringWriter();
        var p = new ProgressReporter(w, live: true, clock.Read);
        p.Observe(new Tessel.Core.Fitting.FitSettings { MaxIterations = 50 });
        p.Stage("fit", "1 start(s)");
        int before = 0, updates = 0;
        // One fit step every three seconds, the timer ticking every second, for a minute.
        for (int s = 1; s <= 60; s++)
        {
            clock.Advance(1);
            if (s % 3 == 0) p.FitStep(Step(s / 3 - 1, 1e-3));
            p.Tick();
            string text = w.ToString();
            int now = text.Split("\r\u001b[2K").Length;
            Assert.True(now > before, $"no status update in second {s}");
            updates += now - before;
            before = now;
        }
        Assert.True(updates >= 60);
        Assert.Contains("[fit]   step 20: largest constraint residual 1E-3, shape RMS 4 mm, 60 s, at most 30 steps left", w.ToString());
        // A new stage line first erases the status line, then stands on its own line.
        p.Stage("checks", "degrees of freedom");
        p.Finish();
        Assert.EndsWith("\r\u001b[2K[checks] degrees of freedom" + Environment.NewLine, w.ToString());
    }

    [Theory]
    [InlineData(1e-2, 1e-4, 2, 300, 6)]   // one decade a step, six decades to go
    [InlineData(1e-2, 1e-4, 2, 5, 2)]     // capped by the steps left (5 - 2 - 1)
    [InlineData(1e-4, 1e-4, 2, 300, -1)]  // not falling: no estimate
    public void StepsLeftFollowTheResidualsRateOfDecrease(double first, double last, int lastStep, int maxSteps, int expected)
    {
        int? left = ProgressReporter.EstimateStepsLeft([(0, first), (lastStep, last)], maxSteps);
        Assert.Equal(expected < 0 ? null : expected, left);
    }
}
