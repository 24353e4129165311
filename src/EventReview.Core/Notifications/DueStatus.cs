namespace EventReview.Core.Notifications;

/// <summary>Where an item's due date stands on a given day (see <see cref="DueRule"/>).</summary>
public enum DueStatus
{
    /// <summary>Due more than a day ahead, or no due date: nothing to say yet.</summary>
    NotYet,

    /// <summary>Due tomorrow.</summary>
    Tomorrow,

    /// <summary>Due today.</summary>
    Today,

    /// <summary>The due date has passed.</summary>
    Overdue,
}
