# The service image: the SDK image builds, the ASP.NET runtime image runs.
FROM mcr.microsoft.com/dotnet/sdk:10.0 AS build
WORKDIR /source
COPY . .
RUN dotnet publish src/PartsOpt.Api/PartsOpt.Api.csproj -c Release -r linux-x64 --self-contained false -o /app

FROM mcr.microsoft.com/dotnet/aspnet:10.0
WORKDIR /app
COPY --from=build /app .
# Inside the container the service listens on every interface; docker-compose publishes it on loopback only.
ENV ASPNETCORE_URLS=http://0.0.0.0:8080
ENV Storage__DatabasePath=/data/partsopt.db
VOLUME /data
EXPOSE 8080
ENTRYPOINT ["dotnet", "PartsOpt.Api.dll"]
