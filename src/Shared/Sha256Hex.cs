using System.Security.Cryptography;
using System.Text;

namespace Briefwright;

/// <summary>
/// SHA-256 as the tool writes it: the one helper behind every fingerprint, manifest checksum and input hash. Lower-case
/// hex everywhere (<see cref="Of(ReadOnlySpan{byte})"/>), except the upper-case forms the files already carry
/// (<see cref="Upper"/>: a theme font family's name and the theme fingerprint's font and logo parts); changing either
/// would change names and fingerprints users already have. One source file compiled into each library that hashes
/// (src/Directory.Build.props), as an internal type.
/// </summary>
internal static class Sha256Hex
{
    public static string Of(ReadOnlySpan<byte> bytes) => Convert.ToHexStringLower(SHA256.HashData(bytes));

    /// <summary>The UTF-8 bytes of <paramref name="text"/>.</summary>
    public static string Of(string text) => Of(Encoding.UTF8.GetBytes(text));

    public static string Of(Stream stream) => Convert.ToHexStringLower(SHA256.HashData(stream));

    /// <summary>The parts one after the other, as if joined (each part prefixed by its length when
    /// <paramref name="lengthPrefixed"/>, so that a boundary cannot move between parts).</summary>
    public static string OfAll(IEnumerable<byte[]> parts, bool lengthPrefixed = false)
    {
        using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        foreach (var part in parts)
        {
            if (lengthPrefixed) sha.AppendData(BitConverter.GetBytes((long)part.Length));
            sha.AppendData(part);
        }
        return Convert.ToHexStringLower(sha.GetHashAndReset());
    }

    /// <summary>The digest itself (32 bytes), for a value derived from content rather than shown as text.</summary>
    public static byte[] Digest(ReadOnlySpan<byte> bytes) => SHA256.HashData(bytes);

    /// <summary>Upper-case hex, where a file or name already carries that form.</summary>
    public static string Upper(ReadOnlySpan<byte> bytes) => Convert.ToHexString(SHA256.HashData(bytes));
}
