namespace EventReview.Data.Notifications;

/// <summary>
/// How far the notification worker has read a growing table (the timeline's entry ids). Advanced in the same save
/// as the notifications it produced, so an entry is neither missed nor told twice; <see cref="Position"/> is a
/// concurrency token, so two app instances cannot both advance it from the same place.
/// </summary>
public sealed class NotificationCursor
{
    public const string Timeline = "timeline";

    private NotificationCursor()
    {
        Name = string.Empty;
    }

    public string Name { get; private set; }

    public long Position { get; private set; }

    public static NotificationCursor Start(string name, long position) => new() { Name = name, Position = position };

    public void MoveTo(long position) => Position = Math.Max(Position, position);
}
