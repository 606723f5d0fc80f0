using Tessel.Core.Geometry;

namespace Tessel.Output.Report;

/// <summary>A fixed orthographic camera looking down on the model from one side, for previews that
/// must look the same on every run. z is up; the camera sits at the given azimuth and elevation.</summary>
public sealed class ObliqueView
{
    /// <summary>Screen right direction in world coordinates (unit).</summary>
    public Vec3 Right { get; }
    /// <summary>Screen up direction in world coordinates (unit).</summary>
    public Vec3 Up { get; }
    /// <summary>Direction from the model toward the camera (unit); larger depth = nearer.</summary>
    public Vec3 Toward { get; }

    /// <param name="azimuthDeg">Angle of the camera around z from the +x axis, degrees.</param>
    /// <param name="elevationDeg">Angle of the camera above the xy-plane, degrees (0..90).</param>
    public ObliqueView(double azimuthDeg = -60, double elevationDeg = 35)
    {
        double az = azimuthDeg * Math.PI / 180, el = elevationDeg * Math.PI / 180;
        Toward = new Vec3(Math.Cos(el) * Math.Cos(az), Math.Cos(el) * Math.Sin(az), Math.Sin(el));
        Right = new Vec3(-Math.Sin(az), Math.Cos(az), 0);
        Up = Vec3.Cross(Toward, Right);
    }

    /// <summary>Screen coordinates (x right, y up, arbitrary origin) and depth of a world point.</summary>
    public (double X, double Y, double Depth) Project(Vec3 p) => (Vec3.Dot(p, Right), Vec3.Dot(p, Up), Vec3.Dot(p, Toward));
}
