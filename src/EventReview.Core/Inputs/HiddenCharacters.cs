using System.Globalization;
using System.Text;

namespace EventReview.Core.Inputs;

/// <summary>
/// Characters that cannot be seen or that reorder what is seen: control characters, Unicode format characters (zero
/// width spaces and joiners, the byte-order mark, soft hyphen, the bidirectional embeddings, overrides and isolates
/// U+202A-U+202E and U+2066-U+2069, tag characters), line and paragraph separators, variation selectors, blank letters
/// (U+115F, U+1160, U+3164, U+FFA0, U+2800) and lone surrogates. Two ids that look the same must be the same id, so ids
/// refuse them (Unicode Technical Standard #39 and the "Trojan Source" report, Boucher and Anderson 2021, describe the abuse).
/// </summary>
public static class HiddenCharacters
{
    /// <summary>The first hidden character of <paramref name="text"/> as "U+XXXX", or null when there is none.</summary>
    public static string? FirstIn(string text) => Find(text) is var (code, _) && code >= 0 ? $"U+{code:X4}" : null;

    /// <summary>The code point of the first hidden character and its position (1-based, in UTF-16 units), or (-1, -1).</summary>
    public static (int CodePoint, int Position) Find(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        for (var i = 0; i < text.Length; i++)
        {
            if (Rune.DecodeFromUtf16(text.AsSpan(i), out var rune, out var used) != System.Buffers.OperationStatus.Done)
            {
                return (text[i], i + 1);
            }

            if (IsHidden(rune))
            {
                return (rune.Value, i + 1);
            }

            i += used - 1;
        }

        return (-1, -1);
    }

    /// <summary>True for a character that is invisible, reorders text, or is a control character.</summary>
    public static bool IsHidden(Rune rune)
    {
        switch (Rune.GetUnicodeCategory(rune))
        {
            case UnicodeCategory.Control:
            case UnicodeCategory.Format:
            case UnicodeCategory.LineSeparator:
            case UnicodeCategory.ParagraphSeparator:
            case UnicodeCategory.Surrogate:
            case UnicodeCategory.PrivateUse:
            case UnicodeCategory.OtherNotAssigned:
                return true;
        }

        var v = rune.Value;
        return v is 0x115F or 0x1160 or 0x3164 or 0xFFA0 or 0x2800 or 0x034F
            || (v >= 0xFE00 && v <= 0xFE0F) || (v >= 0xE0100 && v <= 0xE01EF) // variation selectors
            || (v >= 0x180B && v <= 0x180F); // Mongolian free variation selectors and vowel separator
    }
}
