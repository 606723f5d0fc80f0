namespace Tessel.Core.Jobs;

/// <summary>What the job loader, catalog and memory estimate know of a tessellation family. The
/// tessellation stage's descriptor (<c>TessellationFamily</c>) adds the generator and
/// its advice; Jobs sees only this part, so that it depends on no later stage.</summary>
public abstract class FamilyInfo
{
    /// <summary>The job-file value of <c>tessellation.family</c>.</summary>
    public abstract string Name { get; }

    /// <summary>One line for 'tessel catalog families': the shapes it suits and its parameters.</summary>
    public abstract string Summary { get; }

    /// <summary>Pattern vertices of <paramref name="cellsX"/> x <paramref name="cellsY"/> cells, for
    /// the memory check before the pattern exists.</summary>
    public abstract double Vertices(double cellsX, double cellsY);

    /// <summary>Memory per vertex relative to a Miura sheet's (<see cref="MemoryEstimate"/>): more
    /// constraints per vertex make a fuller factor.</summary>
    public virtual double MemoryFactor => 1.0;
}
