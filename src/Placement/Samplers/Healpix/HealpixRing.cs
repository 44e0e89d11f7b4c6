namespace Placement.Samplers.Healpix;

/// <summary>One iso-latitude ring of a HEALPix RING-ordered sphere.</summary>
/// <remarks>
/// Pixel j (0-based) of the ring has colatitude cos θ = <see cref="Z"/> and azimuth φ = <see cref="FirstPhi"/> +
/// j·<see cref="PhiStep"/>; the ring holds 4·<see cref="QuarterCount"/> pixels, so azimuths come in four
/// quadrants shifted by π/2 (Górski et al. 2005, ApJ 622, 759, eqs. 4–9).
/// </remarks>
/// <param name="Index">Ring index i, 1 … 4N_side − 1 from the north pole.</param>
/// <param name="FirstPixel">RING-order index of the ring's first pixel.</param>
/// <param name="QuarterCount">Pixels per quadrant (i in the polar caps, N_side in the belt).</param>
/// <param name="Z">cos θ of the ring.</param>
/// <param name="SinTheta">sin θ of the ring, computed without cancellation near the poles.</param>
/// <param name="FirstPhi">Azimuth of the first pixel, radians.</param>
/// <param name="PhiStep">Azimuth step between neighbouring pixels, radians (π / (2·QuarterCount)).</param>
/// <param name="ZTop">Upper z of the ring's equal-area band (cos θ), used by stratified sampling.</param>
/// <param name="ZBottom">Lower z of the ring's equal-area band.</param>
public readonly record struct HealpixRing(
    int Index, long FirstPixel, int QuarterCount, double Z, double SinTheta, double FirstPhi, double PhiStep, double ZTop, double ZBottom)
{
    /// <summary>Number of pixels in the ring (4 × <see cref="QuarterCount"/>).</summary>
    public int PixelCount => 4 * QuarterCount;
}
