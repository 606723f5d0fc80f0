using Tessel.Core.Geometry;

namespace Tessel.Core.Sheets;

/// <summary>A rectangle enclosing a point set after turning the set by <see cref="Angle"/> radians
/// (counter-clockwise in x-right/y-up terms, i.e. <see cref="Vec2.Rotated"/>): in the turned frame the
/// points fill [Min.X, Min.X + Width] x [Min.Y, Min.Y + Height].</summary>
public readonly record struct OrientedBox(double Angle, double Width, double Height, Vec2 Min)
{
    public double Area => Width * Height;
}
