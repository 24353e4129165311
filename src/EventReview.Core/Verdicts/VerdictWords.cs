namespace EventReview.Core.Verdicts;

/// <summary>
/// The one mapping between typed verdicts, the stable words stored in computation records (inside their hashes) and the
/// tone they are drawn with. Views and the CLI use this; they never judge a word themselves.
/// </summary>
public static class VerdictWords
{
    private static readonly (Verdict Verdict, string Word, VerdictTone Tone)[] Table =
    [
        (Verdict.NotRun, "not run", VerdictTone.Neutral),
        (Verdict.Consistent, "consistent", VerdictTone.Good),
        (Verdict.Inconsistent, "inconsistent", VerdictTone.Bad),
        (Verdict.Clear, "clear", VerdictTone.Good),
        (Verdict.Concern, "concern", VerdictTone.Attention),
        (Verdict.NothingAdded, "nothing added", VerdictTone.Good),
        (Verdict.SomethingAdded, "something added", VerdictTone.Bad),
        (Verdict.NoDrift, "no drift", VerdictTone.Good),
        (Verdict.Drift, "drift", VerdictTone.Attention),
        (Verdict.Frozen, "frozen", VerdictTone.Good),

        // record format 2
        (Verdict.ResidualIsNoise, "residual is noise", VerdictTone.Good),
        (Verdict.ExcessFound, "excess found", VerdictTone.Bad),
        (Verdict.ModelDoesNotFit, "model does not fit", VerdictTone.Attention),
        (Verdict.BelowThreeSigma, "below 3 sigma", VerdictTone.Neutral),
        (Verdict.ThreeToFiveSigma, "3 to 5 sigma", VerdictTone.Neutral),
        (Verdict.FiveSigmaOrMore, "5 sigma or more", VerdictTone.Neutral),
        (Verdict.AtLeastThreeSigma, "at least 3 sigma", VerdictTone.Neutral),
        (Verdict.VetoSafe, "safe", VerdictTone.Good),
        (Verdict.VetoUnsafe, "unsafe", VerdictTone.Attention),
        (Verdict.SealValid, "valid", VerdictTone.Good),
        (Verdict.SealInvalid, "invalid", VerdictTone.Bad),
        (Verdict.Sealed, "sealed", VerdictTone.Attention),
    ];

    /// <summary>The stored word of <paramref name="verdict"/> (lower case, stable across versions).</summary>
    public static string Word(Verdict verdict)
    {
        foreach (var row in Table)
        {
            if (row.Verdict == verdict)
            {
                return row.Word;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(verdict), verdict, "Verdict has no stored word.");
    }

    /// <summary>The verdict stored as <paramref name="word"/>; false for a word no version of the record format used.</summary>
    public static bool TryParse(string? word, out Verdict verdict)
    {
        foreach (var row in Table)
        {
            if (string.Equals(row.Word, word, StringComparison.Ordinal))
            {
                verdict = row.Verdict;
                return true;
            }
        }

        verdict = Verdict.NotRun;
        return false;
    }

    /// <summary>The tone of <paramref name="verdict"/>.</summary>
    public static VerdictTone Tone(Verdict verdict)
    {
        foreach (var row in Table)
        {
            if (row.Verdict == verdict)
            {
                return row.Tone;
            }
        }

        return VerdictTone.Neutral;
    }

    /// <summary>The tone of a stored word; <see cref="VerdictTone.Neutral"/> for a word this version does not know.</summary>
    public static VerdictTone ToneOf(string? word) => TryParse(word, out var v) ? Tone(v) : VerdictTone.Neutral;
}
