namespace EventReview.Web.Services.Live;

/// <summary>What a case's subscribers are told: only that something changed, never what (they read it themselves).</summary>
public enum LiveSignal
{
    /// <summary>A write on the case committed (or the channel reconnected and something may have been missed): reload.</summary>
    CaseChanged,

    /// <summary>Someone opened, left or moved within the case: redraw who is here.</summary>
    PresenceChanged,
}
