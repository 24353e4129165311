using Microsoft.Extensions.Options;

namespace EventReview.Web.Notifications;

/// <summary>
/// Runs <see cref="NotificationPump"/> every <see cref="NotificationOptions.PollSeconds"/> seconds in the background.
/// A failing pass is logged and the next one runs as usual; review actions never wait for it.
/// </summary>
public sealed class NotificationWorker(IServiceProvider services, IOptions<NotificationOptions> options, ILogger<NotificationWorker> log) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var every = TimeSpan.FromSeconds(options.Value.PollSeconds);
        if (every <= TimeSpan.Zero)
        {
            log.LogInformation("Notification worker off (EventReview:Notifications:PollSeconds is 0)");
            return;
        }

        var pump = services.GetRequiredService<NotificationPump>();
        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                await pump.RunOnceAsync(stoppingToken);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                return;
            }
            catch (Exception ex)
            {
                log.LogError(ex, "Notification pass failed; the next pass runs in {Seconds} s", every.TotalSeconds);
            }

            try
            {
                await Task.Delay(every, stoppingToken);
            }
            catch (OperationCanceledException)
            {
                return;
            }
        }
    }
}
