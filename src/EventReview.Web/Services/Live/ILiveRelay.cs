namespace EventReview.Web.Services.Live;

/// <summary>Carries this instance's live messages to the other instances (PostgreSQL: <see cref="PostgresLiveRelay"/>).</summary>
public interface ILiveRelay
{
    /// <summary>Queues a payload (<see cref="Core.Live.LivePayload"/>) for the other instances; returns at once, never throws.</summary>
    void Send(string payload);
}
