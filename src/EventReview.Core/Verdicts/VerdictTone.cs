namespace EventReview.Core.Verdicts;

/// <summary>How a verdict is drawn: the word and icon carry the meaning, the tone is only a second cue.</summary>
public enum VerdictTone
{
    /// <summary>Not run, or a statement that is neither good nor bad (for example a significance band).</summary>
    Neutral,

    /// <summary>The check found what a reviewer hopes for.</summary>
    Good,

    /// <summary>A person must look before signing.</summary>
    Attention,

    /// <summary>The check failed.</summary>
    Bad,
}
