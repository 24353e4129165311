namespace EventReview.Web.Notifications;

public static class NotificationServiceCollectionExtensions
{
    /// <summary>Notifications: settings (checked at start-up), the worker and its parts, the webhook client, the profile service.</summary>
    /// <exception cref="InvalidOperationException">When a notification setting is wrong; the message names each one.</exception>
    public static IServiceCollection AddEventReviewNotifications(this IServiceCollection services, IConfiguration configuration)
    {
        var section = configuration.GetSection(NotificationOptions.Section);
        var settings = section.Get<NotificationOptions>() ?? new NotificationOptions();
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new InvalidOperationException("EventReview cannot start: the notification settings are wrong.\n - " + string.Join("\n - ", problems)
                + "\nSee docs/operations.md, \"Notifications\".");
        }

        services.Configure<NotificationOptions>(section);
        services.AddSingleton<NotificationComposer>();
        services.AddSingleton<NotificationRouter>();
        services.AddSingleton<SmtpMailer>();
        services.AddSingleton<WebhookSender>();
        services.AddSingleton<OutboxSender>();
        services.AddSingleton<NotificationPump>();
        services.AddSingleton<VerifyFailureReporter>();
        services.AddScoped<NotificationProfile>();
        services.AddHostedService<NotificationWorker>();
        services.AddHttpClient(WebhookSender.ClientName, c => c.Timeout = TimeSpan.FromSeconds(settings.Webhooks.TimeoutSeconds))
            .ConfigurePrimaryHttpMessageHandler(() => new SocketsHttpHandler
            {
                AllowAutoRedirect = false,
                UseCookies = false,
                PooledConnectionLifetime = TimeSpan.FromMinutes(2),
                ConnectCallback = WebhookTarget.Connect(settings.Webhooks.AllowPrivateAddresses),
            });
        return services;
    }
}
