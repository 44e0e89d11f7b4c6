using Placement.Parallelism;
using Placement.Points;
using Placement.Profiles;

namespace Placement.Bodies;

/// <summary>Computes the <see cref="EnergyBudget"/> of placed points against their profile.</summary>
/// <remarks>
/// Points: W by the octree (<see cref="GravitationalEnergy.OfPointsByTree"/>) or, for θ = 0, the exact pairwise sum;
/// U = Σ m u; K = ½ Σ m v². Profile: W = −G ∫ M dM / r, U = ∫ u dm (<see cref="ThermalEnergy"/>),
/// T = ½ ∫ Ω² ϖ² dm (<see cref="KineticEnergy.OfRotatingProfile"/>). The gas points are counted, plus, when the profile
/// has a softened central core (<see cref="IRadialProfile.CentralPointMass"/>, at the origin of the points' frame), the
/// gas's potential energy and Clausius virial in the core's field (<see cref="EnergyBudget"/>); companions travelling
/// with a table are not part of these sums.
/// </remarks>
public static class EnergyBudgets
{

    /// <summary>Energies of the points and of the profile.</summary>
    /// <param name="points">The placed points.</param>
    /// <param name="profile">Their target profile, in the same units.</param>
    /// <param name="internalEnergy">Specific internal energy per point (length²/time²), or null.</param>
    /// <param name="velocity">Velocity components per point (length/time), or null.</param>
    /// <param name="options">Options; defaults when null.</param>
    /// <param name="parallel">Parallelism; never changes the result.</param>
    /// <exception cref="ArgumentException">Units differ, or an array does not have one value per point, or two points coincide.</exception>
    /// <exception cref="ArgumentOutOfRangeException">The opening angle is outside [0, 1] or γ is not &gt; 1.</exception>
    /// <exception cref="InvalidOperationException">Thermodynamics were asked for but the profile lacks the quantity they need.</exception>
    public static EnergyBudget Compute(PointSet points, IRadialProfile profile, double[]? internalEnergy = null,
        (double[] X, double[] Y, double[] Z)? velocity = null, EnergyBudgetOptions? options = null, ParallelSettings? parallel = null)
    {
        ArgumentNullException.ThrowIfNull(points);
        ArgumentNullException.ThrowIfNull(profile);
        var o = options ?? new EnergyBudgetOptions();
        if (points.Units != profile.Units)
            throw new ArgumentException($"The points are in '{points.Units.Name}' units but the profile in '{profile.Units.Name}'.", nameof(points));
        double w = o.OpeningAngle == 0
            ? GravitationalEnergy.OfPoints(points, parallel)
            : GravitationalEnergy.OfPointsByTree(points, o.OpeningAngle, parallel);
        double u = internalEnergy is null ? double.NaN : ThermalEnergy.OfPoints(points, internalEnergy);
        double k = velocity is { } v ? KineticEnergy.OfPoints(points, v.X, v.Y, v.Z) : double.NaN;
        double profileU = o.Thermodynamics is null ? double.NaN : ThermalEnergy.OfProfile(profile, o.Thermodynamics);
        double profileT = o.AngularVelocity is null ? double.NaN : KineticEnergy.OfRotatingProfile(profile, o.AngularVelocity);
        double pointsCore = 0, pointsCoreVirial = 0, profileCore = 0, profileCoreVirial = 0;
        if (profile.CentralPointMass is { } core)
        {
            double g = profile.Units.GravitationalConstant, h = core.SofteningLength;
            for (int i = 0; i < points.Count; i++)
            {
                double r = points.Radius(i);
                pointsCore += points.Mass[i] * SplineSoftening.Potential(r, core.Mass, h, g);
                pointsCoreVirial += points.Mass[i] * r * SplineSoftening.RadialAcceleration(r, core.Mass, h, g);
            }
            profileCore = GravitationalEnergy.OfProfileInCentralField(profile);
            profileCoreVirial = GravitationalEnergy.VirialOfCentralField(profile);
        }
        return new EnergyBudget(points.Units, o.Thermodynamics?.Gamma ?? 5.0 / 3.0, o.OpeningAngle, w, u, k,
            GravitationalEnergy.OfProfile(profile), profileU, profileT, pointsCore, profileCore, pointsCoreVirial, profileCoreVirial);
    }
}
