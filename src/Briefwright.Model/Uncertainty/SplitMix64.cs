namespace Briefwright.Model.Uncertainty;

/// <summary>
/// A small seedable generator (SplitMix64, Steele, Lea &amp; Flood 2014). Integer arithmetic only, so a seed gives
/// the same uniforms everywhere; each draw gets its own stream from (seed, draw index), so results do not depend on
/// how draws are spread over threads.
/// </summary>
public struct SplitMix64
{
    private ulong state;

    public SplitMix64(ulong seed) => state = seed;

    public static SplitMix64 ForStream(ulong seed, ulong stream)
    {
        var mixer = new SplitMix64(seed ^ (0x9E3779B97F4A7C15UL * (stream + 1)));
        return new SplitMix64(mixer.NextUInt64());
    }

    public ulong NextUInt64()
    {
        ulong z = state += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>A uniform number in the open interval (0, 1), from the top 53 bits.</summary>
    public double NextOpenUnit() => ((NextUInt64() >> 11) + 0.5) * (1.0 / 9007199254740992.0);
}
