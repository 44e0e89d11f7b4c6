namespace Placement.Samplers;

/// <summary>The value type of a sampler parameter, which decides how its text is parsed.</summary>
public enum SamplerParameterKind
{
    /// <summary>A 32-bit integer, e.g. <c>4</c>.</summary>
    Integer,

    /// <summary>A real number in invariant culture, e.g. <c>0.5</c> or <c>1e-3</c>.</summary>
    Real,

    /// <summary><c>true</c> or <c>false</c> (also <c>yes</c>/<c>no</c>, <c>1</c>/<c>0</c>).</summary>
    Boolean,

    /// <summary>One word out of a fixed list, case-insensitive.</summary>
    Choice,

    /// <summary>Three real numbers separated by commas, e.g. <c>0.1,0,0.25</c>.</summary>
    RealTriple,

    /// <summary>A rotation: <c>identity</c>, <c>random</c> (drawn from the seed), or a quaternion <c>w,x,y,z</c> (normalised).</summary>
    Rotation,

    /// <summary>Free text taken as given after trimming, e.g. a file path (may be empty).</summary>
    Text,
}
