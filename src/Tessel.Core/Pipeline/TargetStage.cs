using Tessel.Core.Jobs;
using Tessel.Core.Targets;

namespace Tessel.Core.Pipeline;

/// <summary>The target built from a job, with its figures.</summary>
public sealed record TargetStageResult(ITargetSurface Target, TargetFigures Figures);

/// <summary>First pipeline stage: job target section -> checked target surface in metres.</summary>
public static class TargetStage
{
    /// <summary>Builds the target, checks it over the footprint and measures it.</summary>
    /// <exception cref="JobError">The target cannot be built or is undefined somewhere over its footprint.</exception>
    public static TargetStageResult Run(Job job, GrayImageDecoder? decodeImage, ProgressReporter progress)
    {
        progress.Stage("target", $"building {job.Target.Kind} target");
        var target = TargetFactory.Build(job.Target, job.BaseDirectory, decodeImage);
        progress.Step(target.Description);
        var figures = TargetFigures.Measure(job.Target.Kind, target);
        progress.Step($"height {figures.MinHeight:0.###} to {figures.MaxHeight:0.###} m, Gaussian curvature {figures.MinGaussianCurvature:0.####} to {figures.MaxGaussianCurvature:0.####} 1/m^2");
        return new TargetStageResult(target, figures);
    }
}
